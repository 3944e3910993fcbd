// Password hashing with Argon2id at (or above) the OWASP Password Storage Cheat Sheet minimum:
// 19 MiB memory, 2 iterations, parallelism 1.
import { hash, verify } from "@node-rs/argon2";

import { AppError } from "@/lib/http/app-error";

export const ARGON2_PARAMS = {
  algorithm: 2, // Argon2id (the package's const enum Algorithm.Argon2id)
  memoryCost: 19_456, // KiB = 19 MiB
  timeCost: 2,
  parallelism: 1,
} as const;

/**
 * The shortest password Sward accepts wherever one is set or changed. Staff sign in with the
 * password alone (no second factor), and NIST SP 800-63B-4 (2025) §3.1.1.2 requires at least 15
 * characters for a password used as a single-factor authenticator (8 when it is one of two), counts
 * each Unicode code point as one character, and forbids composition rules — so there are none.
 */
export const MIN_PASSWORD_LENGTH = 15;
/** The same ceiling as the sign-in form; NIST asks verifiers to accept at least 64. */
const MAX_PASSWORD_LENGTH = 1024;

/** What is wrong with a new password, in words for the person choosing it; null when it is fine. */
function newPasswordProblem(password: string): string | null {
  const length = [...password].length;
  if (length < MIN_PASSWORD_LENGTH)
    return `Choose a password of at least ${MIN_PASSWORD_LENGTH} characters. A few unrelated words make a good one.`;
  if (length > MAX_PASSWORD_LENGTH) return "That password is too long.";
  return null;
}

/** Hashes a password being set or changed; refuses one shorter than MIN_PASSWORD_LENGTH. */
export async function hashPassword(password: string): Promise<string> {
  const problem = newPasswordProblem(password);
  if (problem) throw new AppError("invalid_input", problem, { password: [problem] });
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
