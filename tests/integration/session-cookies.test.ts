// The session cookie as Auth.js issues it on a password sign-in (OWASP ASVS 5.0 V3.3: cookie
// attributes): HttpOnly and SameSite=Lax always; over https also Secure and with the __Secure-
// prefix, which Sward's session reader looks for first (lib/auth/session.ts SESSION_COOKIES).
// Runs the app's own Auth.js handlers in-process with requests addressed to http and https.
import { describe, expect, it } from "vitest";

import { handlers } from "@/lib/auth/config";
import { SESSION_COOKIES } from "@/lib/auth/session";

import { createTestCompany, TEST_PASSWORD } from "../helpers/factories";

async function signInOver(origin: string, email: string): Promise<string[]> {
  const csrfRes = await handlers.GET(new Request(`${origin}/api/auth/csrf`) as never);
  const { csrfToken } = (await csrfRes.json()) as { csrfToken: string };
  const jar = csrfRes.headers
    .getSetCookie()
    .map((c) => c.split(";")[0]!)
    .join("; ");
  const res = await handlers.POST(
    new Request(`${origin}/api/auth/callback/credentials`, {
      method: "POST",
      headers: {
        "content-type": "application/x-www-form-urlencoded",
        cookie: jar,
        origin,
        "x-forwarded-for": "198.51.100.200",
      },
      body: new URLSearchParams({ csrfToken, email, password: TEST_PASSWORD, callbackUrl: "/" }),
    }) as never,
  );
  expect(res.status).toBe(302);
  return [...csrfRes.headers.getSetCookie(), ...res.headers.getSetCookie()];
}

const attributes = (cookie: string) =>
  cookie
    .split(";")
    .slice(1)
    .map((a) => a.trim().toLowerCase());

describe("the session cookie", () => {
  it("over https: __Secure- prefix, Secure, HttpOnly, SameSite=Lax, Path=/", async () => {
    const c = await createTestCompany();
    const cookies = await signInOver("https://sward.test", c.emails.manager!);
    const session = cookies.find((x) => x.startsWith(`${SESSION_COOKIES[0]}=`));
    expect(session, cookies.join("\n")).toBeDefined();
    expect(attributes(session!)).toEqual(
      expect.arrayContaining(["secure", "httponly", "samesite=lax", "path=/"]),
    );
    // Every cookie Auth.js sets over https is Secure and HttpOnly.
    for (const cookie of cookies)
      expect(attributes(cookie), cookie).toEqual(expect.arrayContaining(["secure", "httponly"]));
    console.log(
      `cookies over https: ${cookies
        .map(
          (x) =>
            `${x.split("=")[0]} [${attributes(x)
              .filter((a) => !a.startsWith("expires"))
              .join("; ")}]`,
        )
        .join(", ")}`,
    );
  });

  it("over plain http (local development): HttpOnly and SameSite=Lax, without Secure", async () => {
    const c = await createTestCompany();
    const cookies = await signInOver("http://localhost:3000", c.emails.tech1!);
    const session = cookies.find((x) => x.startsWith(`${SESSION_COOKIES[1]}=`));
    expect(session, cookies.join("\n")).toBeDefined();
    expect(attributes(session!)).toEqual(
      expect.arrayContaining(["httponly", "samesite=lax", "path=/"]),
    );
    expect(attributes(session!)).not.toContain("secure");
  });
});
