import argon2 from 'argon2';

// argon2id at OWASP's recommended floor (19 MiB, 2 passes): strong, and quick enough that
// a sign-in never keeps a player waiting.
const options = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, options);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;

/** Spends the same time as a real check, so an unknown address can't be told apart by timing. */
export async function verifyAgainstNothing(password: string): Promise<void> {
  dummyHash ??= hashPassword('no account has this password');
  await verifyPassword(await dummyHash, password);
}
