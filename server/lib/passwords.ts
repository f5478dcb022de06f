import argon2 from 'argon2';

/**
 * argon2id parameters at or above the OWASP Password Storage Cheat Sheet floor
 * (m = 19 MiB, t = 2, p = 1); we take 19 MiB and 3 passes.
 */
export const ARGON2_OPTIONS = {
  type: argon2.argon2id,
  memoryCost: 19 * 1024,
  timeCost: 3,
  parallelism: 1,
} as const;

/** Hashes a password with argon2id; the result embeds salt and parameters. */
export function hashPassword(password: string): Promise<string> {
  return argon2.hash(password, ARGON2_OPTIONS);
}

/** Checks a password against a stored argon2 hash; false on any mismatch or bad hash. */
export async function verifyPassword(hash: string, password: string): Promise<boolean> {
  try {
    return await argon2.verify(hash, password);
  } catch {
    return false;
  }
}
