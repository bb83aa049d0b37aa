// Placeholder replaced below once the database harness exists.
export default async function globalSetup(): Promise<void> {}
