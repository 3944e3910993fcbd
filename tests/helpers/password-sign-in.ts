// A password sign-in over HTTP exactly as the sign-in form does it: Auth.js's CSRF token, then its
// credentials callback. Used by the e2e tests, the benchmark and the crash suite.

export interface PasswordSignIn {
  status: number;
  /** Every cookie Auth.js set, as one `cookie` header value. */
  cookie: string;
  /** The session token alone ("" when sign-in failed). */
  sessionToken: string;
  csrfToken: string;
}

export async function passwordSignIn(
  base: string,
  email: string,
  password: string,
): Promise<PasswordSignIn> {
  const jar = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(";");
      const [name, ...value] = pair!.split("=");
      jar.set(name!, value.join("="));
    }
  };
  const header = () => [...jar].map(([k, v]) => `${k}=${v}`).join("; ");
  const csrf = await fetch(`${base}/api/auth/csrf`);
  keep(csrf);
  const { csrfToken } = (await csrf.json()) as { csrfToken: string };
  const res = await fetch(`${base}/api/auth/callback/credentials`, {
    method: "POST",
    redirect: "manual",
    headers: {
      "content-type": "application/x-www-form-urlencoded",
      cookie: header(),
      origin: base,
    },
    body: new URLSearchParams({ csrfToken, email, password, callbackUrl: "/" }),
  });
  keep(res);
  await res.arrayBuffer();
  const sessionToken =
    jar.get("authjs.session-token") ?? jar.get("__Secure-authjs.session-token") ?? "";
  return { status: res.status, cookie: header(), sessionToken, csrfToken };
}
