// Tokens that travel in e-mailed links (sign-in links, homeowner invitations): 32 random bytes in
// hex, as Auth.js makes its e-mail tokens; only sha256(token + AUTH_SECRET) is stored, as Auth.js
// stores them, so a copy of the database alone does not open any link.
import { createHash, randomBytes } from "node:crypto";

/** A fresh link token (256 bits from the system's CSPRNG). */
export function newLinkToken(): string {
  return randomBytes(32).toString("hex");
}

/** What is stored and later looked up for a link's token: sha256 of the token and the secret. */
export function hashedToken(token: string, secret: string): string {
  return createHash("sha256").update(`${token}${secret}`).digest("hex");
}
