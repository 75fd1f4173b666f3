import 'server-only';
import { hash, verify } from '@node-rs/argon2';

// OWASP Password Storage Cheat Sheet, argon2id: m = 19 MiB, t = 2, p = 1.
// (The package's default algorithm is argon2id; its enum is a const enum we cannot import.)
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verified against when the e-mail is unknown, so a miss costs as long as a wrong password.
let dummyHash: Promise<string> | undefined;
export async function burnPasswordCheck(password: string): Promise<void> {
  dummyHash ??= hashPassword('ringpass-timing-equaliser');
  await verifyPassword(await dummyHash, password);
}
