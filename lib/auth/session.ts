// Turns the current request into an Actor (or null): the session cookie's JWT names a session,
// the database says whether it is still valid and who is behind it. Memoised per request.
//
// The cookie is decoded here with next-auth's own `decode` rather than through `auth()`: `auth()`
// runs the whole Auth.js session endpoint and re-issues the cookie on every request (measured in
// tests/bench; the figure is in README.md). Sessions therefore end 14 days after sign-in
// (the JWT's and the auth_sessions row's expiry), not 14 days after the last request.
import "server-only";

import { decode } from "next-auth/jwt";
import { cookies } from "next/headers";
import { cache } from "react";

import { serverEnv } from "@/lib/env";

import type { Actor } from "./actor";
import { findActorBySession } from "./queries";

/** Auth.js's session cookie: with the __Secure- prefix when served over https. */
export const SESSION_COOKIES = ["__Secure-authjs.session-token", "authjs.session-token"] as const;

/**
 * Decrypting the cookie (key derivation and JWE) cost about 1 ms of the web process's CPU per
 * request (tests/bench), so each cookie that decrypted is remembered with the session id it names
 * until the token's own expiry. The cache only skips the decryption: whether the session is still
 * valid, and who is behind it, is read from the database on every request.
 */
const decodedTokens = new Map<string, { sessionId: string; expiresAtMs: number }>();
const DECODED_TOKENS_MAX = 1000;

async function sessionIdOf(name: string, value: string): Promise<string | null> {
  const key = `${name}\n${value}`;
  const known = decodedTokens.get(key);
  if (known && known.expiresAtMs > Date.now()) return known.sessionId;
  decodedTokens.delete(key);
  const token = await decode({ token: value, secret: serverEnv().AUTH_SECRET, salt: name }).catch(
    () => null,
  );
  const sessionId = token?.sid;
  if (typeof sessionId !== "string") return null;
  if (typeof token?.exp === "number") {
    if (decodedTokens.size >= DECODED_TOKENS_MAX)
      decodedTokens.delete(decodedTokens.keys().next().value!);
    decodedTokens.set(key, { sessionId, expiresAtMs: token.exp * 1000 });
  }
  return sessionId;
}

export const getActor = cache(async (): Promise<Actor | null> => {
  const jar = await cookies();
  for (const name of SESSION_COOKIES) {
    const value = jar.get(name)?.value;
    if (!value) continue;
    const sessionId = await sessionIdOf(name, value);
    if (sessionId) return (await findActorBySession(sessionId)) ?? null;
  }
  return null;
});
