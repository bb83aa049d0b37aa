import { hash, verify } from '@node-rs/argon2';

// argon2id with OWASP's second recommended setting (19 MiB, 2 passes, 1 lane).
const options = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, options);
}

export async function verifyPassword(storedHash: string, password: string): Promise<boolean> {
  try {
    return await verify(storedHash, password);
  } catch {
    return false;
  }
}

// A real hash to verify against for unknown e-mails, so both answers take the same time.
let decoy: Promise<string> | null = null;
export function decoyHash(): Promise<string> {
  decoy ??= hash('decoy-password-for-timing', options);
  return decoy;
}
