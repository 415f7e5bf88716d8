import { burnPasswordCheck, hashPassword, verifyPassword } from '../../server/auth/password';

// Test users are hashed cheaply (test/support/api-harness.ts); this spec holds the product to its cost:
// Argon2id at 19 MiB, two passes, one lane (OWASP Password Storage Cheat Sheet's first option).
describe('password hashes', () => {
  it('when the product hashes a password, then it uses Argon2id at m=19456 KiB, t=2, p=1', async () => {
    const hashed = await hashPassword('a long enough passphrase');
    expect(hashed).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$/);
  });

  it('when the password is checked, then only the right one verifies', async () => {
    const hashed = await hashPassword('a long enough passphrase');
    await expect(verifyPassword(hashed, 'a long enough passphrase')).resolves.toBe(true);
    await expect(verifyPassword(hashed, 'a long enough passphrasE')).resolves.toBe(false);
    await expect(verifyPassword('not a hash', 'anything')).resolves.toBe(false);
  });

  it('when the username is unknown, then a check still runs against a decoy and never throws', async () => {
    await expect(burnPasswordCheck('whatever')).resolves.toBeUndefined();
  });
});
