import { e2eDatabaseName, prepareDatabase } from './global-setup';

export default function globalSetup(): Promise<void> {
  return prepareDatabase(e2eDatabaseName());
}
