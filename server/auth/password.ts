import { hash, verify } from '@node-rs/argon2';

/** Argon2id at OWASP's minimum cost (19 MiB, t=2, p=1): about 50 ms here, slow enough for guessing. */
const OPTIONS = {
  algorithm: 2 /* Argon2id; the package's enum is a const enum, unusable with isolatedModules */,
  memoryCost: 19_456,
  timeCost: 2,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(hashed: string, password: string): Promise<boolean> {
  try {
    return await verify(hashed, password);
  } catch {
    return false;
  }
}

// Verifying against a throw-away hash when the username is unknown keeps response times alike,
// so timing does not reveal which usernames exist.
let decoy: Promise<string> | undefined;
export async function burnPasswordCheck(password: string): Promise<void> {
  decoy ??= hashPassword('decoy-password-never-used');
  await verifyPassword(await decoy, password);
}
