import { hash, verify } from '@node-rs/argon2';

/** argon2id with the OWASP-recommended minimum (m = 19 MiB, t = 2, p = 1). */
const ARGON2ID = { algorithm: 2, memoryCost: 19456, timeCost: 2, parallelism: 1, outputLen: 32 } as const;

export const MIN_PASSWORD_LENGTH = 10;

export async function hashPassword(password: string): Promise<string> {
  if (password.length < MIN_PASSWORD_LENGTH) {
    throw new RangeError(`password must have at least ${MIN_PASSWORD_LENGTH} characters`);
  }
  return hash(password, ARGON2ID);
}

/** True when `password` matches `passwordHash`; false (never a throw) for a malformed hash. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;
/** Spends the same time as a real check, so a missing account cannot be told apart by timing. */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hash('resetwise-timing-equaliser', ARGON2ID);
  await verifyPassword(await dummyHash, password);
  return false;
}
