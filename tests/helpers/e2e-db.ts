// For e2e tests that prepare their own records: point this test process's data-access layer at
// the e2e database the server uses, and mint session cookies exactly as sign-in does (a session
// row, its id in Auth.js's encrypted JWT), so a test does not spend the sign-in throttle.
import { inject } from "vitest";

export const SESSION_COOKIE = "authjs.session-token"; // plain http, as the e2e server is served

export function useE2eDatabase(): void {
  process.env.DATABASE_URL = inject("databaseUrl");
  process.env.AUTH_SECRET = inject("authSecret");
  process.env.PHOTO_DIR = inject("photoDir");
}

/** A `cookie` header value holding a fresh session of this user. */
export async function mintSessionCookie(userId: string, maxAgeSeconds = 3600): Promise<string> {
  const [{ createAuthSession }, { encode }] = await Promise.all([
    import("@/lib/auth/mutations"),
    import("next-auth/jwt"),
  ]);
  const sid = await createAuthSession(userId, maxAgeSeconds);
  return `${SESSION_COOKIE}=${await encode({ token: { sid }, secret: process.env.AUTH_SECRET!, salt: SESSION_COOKIE, maxAge: maxAgeSeconds })}`;
}
