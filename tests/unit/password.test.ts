import { scryptSync } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { hashPassword, verifyPassword } from '../../apps/api/src/auth/password.ts';

describe('password hashing', () => {
  it('verifies the right password and refuses a wrong one', async () => {
    const hash = await hashPassword('correct horse battery', 10);
    expect(await verifyPassword('correct horse battery', hash)).toBe(true);
    expect(await verifyPassword('correct horse batterx', hash)).toBe(false);
  });

  it('salts every hash, so equal passwords give different hashes', async () => {
    expect(await hashPassword('same password here', 10)).not.toBe(await hashPassword('same password here', 10));
  });

  it('stores scrypt parameters with the hash and matches an independent scrypt computation', async () => {
    const hash = await hashPassword('independent check', 10);
    const [kind, logN, r, p, salt, key] = hash.split('$');
    expect([kind, logN, r, p]).toEqual(['scrypt', '10', '8', '1']);
    // Node's synchronous scrypt, called directly with the stored salt, is the oracle here.
    const expected = scryptSync('independent check', Buffer.from(salt!, 'base64url'), 32, { N: 1024, r: 8, p: 1 });
    expect(key).toBe(expected.toString('base64url'));
  });

  it('never matches a malformed or foreign hash', async () => {
    expect(await verifyPassword('anything', 'md5$abc')).toBe(false);
    expect(await verifyPassword('anything', '')).toBe(false);
  });
});
