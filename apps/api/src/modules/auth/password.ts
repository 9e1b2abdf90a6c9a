import argon2 from 'argon2';

// OWASP Password Storage Cheat Sheet's minimum for argon2id: m=19 MiB, t=2, p=1.
export const passwordHashOptions = {
  type: argon2.argon2id,
  memoryCost: 19 * 1024,
  timeCost: 2,
  parallelism: 1,
} as const;

export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, passwordHashOptions);
}

export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}

let dummyHash: Promise<string> | undefined;
/** Spends the same work as a real check, so an unknown e-mail answers no faster than a wrong password. */
export async function verifyAgainstDummy(password: string): Promise<false> {
  dummyHash ??= hashPassword('heatfleet-timing-equaliser');
  await verifyPassword(await dummyHash, password);
  return false;
}
