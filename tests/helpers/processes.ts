// Small process helpers for test setup: wait for a URL. (Commands run through
// tests/harness/supervisor.ts, which stops them on every exit path.)
export async function waitForUrl(url: string, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    try {
      const response = await fetch(url, { redirect: "manual" });
      if (response.status < 500) return;
    } catch (err) {
      lastError = err;
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`${url} did not answer within ${timeoutMs} ms: ${String(lastError)}`);
}

export const TSX = "node_modules/.bin/tsx";
