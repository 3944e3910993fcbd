// The one React Query client factory: a new client per server request, one per browser tab.
import { isServer, QueryClient } from "@tanstack/react-query";

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000, // data prefetched on the server is not refetched at once on hydration
        refetchOnWindowFocus: true,
        retry: (failureCount, error) =>
          failureCount < 2 && !(error instanceof HttpError && error.status < 500),
      },
    },
  });
}

let browserClient: QueryClient | undefined;

export function getQueryClient(): QueryClient {
  if (isServer) return makeQueryClient();
  browserClient ??= makeQueryClient();
  return browserClient;
}

export class HttpError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
  ) {
    super(message);
  }
}

/** GET a JSON route of ours; errors arrive as { error: { code, message } }. */
export async function fetchJson<T>(url: string): Promise<T> {
  const response = await fetch(url, {
    headers: { Accept: "application/json" },
    credentials: "same-origin",
  });
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const error = (body as { error?: { code?: string; message?: string } } | null)?.error;
    throw new HttpError(
      response.status,
      error?.code ?? "http_error",
      error?.message ?? `Request failed (${response.status}).`,
    );
  }
  return body as T;
}

export type SendResult<T> =
  | { ok: true; status: number; data: T }
  | {
      ok: false;
      status: number;
      error: {
        code: string;
        message: string;
        fieldErrors?: Record<string, string[]>;
        details?: Record<string, unknown>;
      };
    };

/** POST/PUT/DELETE JSON to a route of ours. Network failures come back as status 0, never thrown. */
export async function sendJson<T>(
  method: "POST" | "PUT" | "PATCH" | "DELETE",
  url: string,
  body?: unknown,
  init: { keepalive?: boolean } = {},
): Promise<SendResult<T>> {
  try {
    const response = await fetch(url, {
      method,
      headers: { "Content-Type": "application/json", Accept: "application/json" },
      credentials: "same-origin",
      body: body === undefined ? undefined : JSON.stringify(body),
      keepalive: init.keepalive,
    });
    const parsed: unknown = await response.json().catch(() => null);
    if (response.ok) return { ok: true, status: response.status, data: parsed as T };
    const error = (
      parsed as { error?: SendResult<T> extends { ok: false; error: infer E } ? E : never } | null
    )?.error;
    return {
      ok: false,
      status: response.status,
      error: error ?? { code: "http_error", message: `The server answered ${response.status}.` },
    };
  } catch {
    return {
      ok: false,
      status: 0,
      error: { code: "offline", message: "No connection to Sward right now." },
    };
  }
}
