import { hash, verify } from '@node-rs/argon2'

/**
 * argon2id with the OWASP Password Storage Cheat Sheet's minimum configuration:
 * m = 19 MiB (19456 KiB), t = 2 iterations, p = 1. argon2id is the library's default algorithm;
 * it is left implicit because its const enum does not survive `next build`'s isolated modules.
 */
export const PASSWORD_HASH_OPTIONS = { memoryCost: 19_456, timeCost: 2, parallelism: 1 } as const

/** Hashes a password for storage, e.g. `await hashPassword('linen-thread-42')` → `$argon2id$v=19$m=19456,t=2,p=1$…`. */
export function hashPassword(password: string): Promise<string> {
  return hash(password, PASSWORD_HASH_OPTIONS)
}

/** True when the password matches the stored hash; a malformed hash is a mismatch, not a crash. */
export async function isPasswordCorrect(storedHash: string, password: string): Promise<boolean> {
  try {
    return await verify(storedHash, password)
  } catch {
    return false
  }
}
