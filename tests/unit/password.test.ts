import { scryptSync } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { hashPassword, needsRehash, unmatchableHash, verifyPassword } from '../../apps/api/src/auth/password.ts';

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
    expect([kind, logN, r, p]).toEqual(['scrypt', '10', '8', '3']);
    // Node's synchronous scrypt, called directly with the stored salt, is the oracle here.
    const expected = scryptSync('independent check', Buffer.from(salt!, 'base64url'), 32, { N: 1024, r: 8, p: 3 });
    expect(key).toBe(expected.toString('base64url'));
  });

  it('answers every one of many hashes asked for at once, each its own', async () => {
    const passwords = Array.from({ length: 7 }, (_, i) => `password number ${i}`);
    const hashes = await Promise.all(passwords.map((p) => hashPassword(p, 10)));
    const checks = await Promise.all(passwords.flatMap((p, i) => [verifyPassword(p, hashes[i]!), verifyPassword(p, hashes[(i + 1) % 7]!)]));
    expect(checks).toEqual(passwords.flatMap(() => [true, false]));
  });

  it('still verifies a hash made at an older cost, and says it should be made again', async () => {
    // A hash as made before at N=2^10, r=8, p=1, by Node's own scrypt.
    const salt = Buffer.from('0123456789abcdef');
    const old = ['scrypt', 10, 8, 1, salt.toString('base64url'), scryptSync('older cost', salt, 32, { N: 1024, r: 8, p: 1 }).toString('base64url')].join('$');
    expect(await verifyPassword('older cost', old)).toBe(true);
    expect(needsRehash(old, 10)).toBe(true);
    expect(needsRehash(await hashPassword('older cost', 10), 10)).toBe(false);
    expect(needsRehash(await hashPassword('older cost', 10), 11)).toBe(true);
  });

  it('never matches a malformed or foreign hash, nor the hash that stands in for an unknown e-mail', async () => {
    expect(await verifyPassword('', unmatchableHash(10))).toBe(false);
    expect(await verifyPassword('AAAA', unmatchableHash(10))).toBe(false);
    expect(await verifyPassword('anything', 'md5$abc')).toBe(false);
    expect(await verifyPassword('anything', '')).toBe(false);
  });
});
