// Password hashing with Argon2id at (or above) the OWASP Password Storage Cheat Sheet minimum:
// 19 MiB memory, 2 iterations, parallelism 1.
import { hash, verify } from "@node-rs/argon2";

export const ARGON2_PARAMS = {
  algorithm: 2, // Argon2id (the package's const enum Algorithm.Argon2id)
  memoryCost: 19_456, // KiB = 19 MiB
  timeCost: 2,
  parallelism: 1,
} as const;

export const MIN_PASSWORD_LENGTH = 10;

export function hashPassword(password: string): Promise<string> {
  return hash(password, ARGON2_PARAMS);
}

/** Compares in constant time inside the library; false (never throws) for a malformed hash. */
export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

// Verified against when the e-mail is unknown, so both paths cost one Argon2 verification and
// response time does not reveal whether an account exists.
let decoyHash: Promise<string> | undefined;
export function decoyPasswordHash(): Promise<string> {
  decoyHash ??= hashPassword("decoy-password-that-never-matches");
  return decoyHash;
}
