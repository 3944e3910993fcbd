// The crash suite's client: signs in through Auth.js's credentials callback as the sign-in form
// does, and sends requests the way the app's offline queue does: a request that fails with a
// network error or a 5xx is sent again, unchanged (same client id, same body), after a short
// back-off; any other answer is final.
import { passwordSignIn } from "../helpers/password-sign-in";

export class Client {
  /** Requests on the wire right now. */
  inFlight = 0;
  networkRetries = 0;
  serverErrorRetries = 0;
  /** Set when the run is being torn down: deliver() stops retrying. */
  stopped = false;

  constructor(
    readonly base: string,
    private readonly cookie: string,
  ) {}

  static async signIn(base: string, email: string, password: string): Promise<Client> {
    const result = await passwordSignIn(base, email, password);
    if (!result.sessionToken)
      throw new Error(`crash: could not sign in as ${email} (status ${result.status})`);
    return new Client(base, result.cookie);
  }

  /** The signed-in session's headers, for a request sent by hand. */
  headers(): Record<string, string> {
    return { cookie: this.cookie, origin: this.base };
  }

  /** One attempt, no retry (setup steps before the crashes start). */
  async once<T>(method: string, path: string, body?: unknown): Promise<T> {
    const res = await fetch(`${this.base}${path}`, {
      method,
      headers: {
        cookie: this.cookie,
        origin: this.base,
        ...(body === undefined ? {} : { "content-type": "application/json" }),
      },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!res.ok)
      throw new Error(`crash: ${method} ${path} answered ${res.status}: ${await res.text()}`);
    return (await res.json()) as T;
  }

  /**
   * Sends until an answer other than a network error or a 5xx arrives, or `giveUpAfterMs` passed.
   * Returns the final status (0 when it gave up) and body, how many attempts it took and when the
   * last one was sent.
   */
  async deliver(
    method: string,
    path: string,
    body: Buffer | string,
    contentType: string,
    giveUpAfterMs = 120_000,
  ): Promise<{ status: number; body: unknown; attempts: number; lastSentAt: number }> {
    const started = Date.now();
    for (let attempt = 1; ; attempt++) {
      let status = 0;
      let answer: unknown = null;
      const sentAt = Date.now();
      this.inFlight++;
      try {
        const res = await fetch(`${this.base}${path}`, {
          method,
          headers: { cookie: this.cookie, origin: this.base, "content-type": contentType },
          body: typeof body === "string" ? body : new Uint8Array(body),
          signal: AbortSignal.timeout(20_000),
        });
        status = res.status;
        const text = await res.text();
        answer = text ? JSON.parse(text) : null;
      } catch {
        status = 0; // connection refused or reset, timeout, or a body cut short
      } finally {
        this.inFlight--;
      }
      if (status !== 0 && status < 500)
        return { status, body: answer, attempts: attempt, lastSentAt: sentAt };
      if (status === 0) this.networkRetries++;
      else this.serverErrorRetries++;
      if (this.stopped || Date.now() - started > giveUpAfterMs)
        return { status: 0, body: answer, attempts: attempt, lastSentAt: sentAt };
      // 100 ms, 200 ms, 400 ms … up to 1.6 s, with jitter so retries do not arrive together.
      const delay = Math.min(1600, 100 * 2 ** Math.min(attempt - 1, 4)) * (0.5 + Math.random() / 2);
      await new Promise((r) => setTimeout(r, delay));
    }
  }
}
