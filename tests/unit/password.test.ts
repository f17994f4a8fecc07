import { describe, expect, it } from 'vitest';
import { hashPassword, verifyAgainstDummy, verifyPassword } from '../../src/lib/server/password';

describe('password hashing (argon2id)', () => {
  it('hashes with argon2id at m=19456 KiB, t=2, p=1 and verifies the right password only', async () => {
    const hash = await hashPassword('correct horse battery');
    expect(hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
    expect(await verifyPassword(hash, 'correct horse battery')).toBe(true);
    expect(await verifyPassword(hash, 'correct horse batterY')).toBe(false);
  });

  it('salts every hash', async () => {
    expect(await hashPassword('same password here')).not.toBe(await hashPassword('same password here'));
  });

  it('refuses passwords shorter than 10 characters', async () => {
    await expect(hashPassword('short')).rejects.toThrow(/at least 10/);
  });

  it('treats a malformed hash as a mismatch, not a crash', async () => {
    expect(await verifyPassword('not-a-hash', 'whatever-password')).toBe(false);
  });

  it('the dummy check for unknown accounts always says no', async () => {
    expect(await verifyAgainstDummy('resetwise-timing-equaliser')).toBe(false);
  });
});
