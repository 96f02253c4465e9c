import argon2 from 'argon2';

/** argon2id at the OWASP Password Storage Cheat Sheet minimum: 19 MiB memory, 2 iterations, 1 lane. */
const OPTIONS = { type: argon2.argon2id, memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const;

export const hashPassword = (password: string) => argon2.hash(password, OPTIONS);

let dummy: Promise<string> | undefined;

/**
 * Verifies a password; with no stored hash (unknown e-mail, invitation pending) it still spends
 * the same work on a dummy hash so timing does not tell whether an account exists.
 */
export async function verifyPassword(hash: string | null | undefined, password: string): Promise<boolean> {
  if (!hash) {
    dummy ??= hashPassword('loadline-timing-equaliser');
    await argon2.verify(await dummy, password).catch(() => false);
    return false;
  }
  return argon2.verify(hash, password).catch(() => false);
}

export const MIN_PASSWORD_LENGTH = 12;
