import { hash, verify } from '@node-rs/argon2';

/** argon2id with the library's defaults (19 MiB, 2 passes), the OWASP minimum (from memory). */
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verified against when an e-mail is unknown, so a miss costs as long as a wrong password
// and response times do not reveal which e-mails have accounts.
let dummyHash: Promise<string> | undefined;
export function dummyPasswordHash(): Promise<string> {
  dummyHash ??= hash('not-a-real-password');
  return dummyHash;
}
