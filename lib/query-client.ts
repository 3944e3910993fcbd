// The one React Query client factory: a new client per server request, one per browser tab.
import { QueryClient, isServer } from "@tanstack/react-query";

export function makeQueryClient(): QueryClient {
  return new QueryClient({
    defaultOptions: {
      queries: {
        staleTime: 30_000, // data prefetched on the server is not refetched at once on hydration
        refetchOnWindowFocus: true,
        retry: (failureCount, error) => failureCount < 2 && !(error instanceof HttpError && error.status < 500),
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
  const response = await fetch(url, { headers: { Accept: "application/json" }, credentials: "same-origin" });
  const body: unknown = await response.json().catch(() => null);
  if (!response.ok) {
    const error = (body as { error?: { code?: string; message?: string } } | null)?.error;
    throw new HttpError(response.status, error?.code ?? "http_error", error?.message ?? `Request failed (${response.status}).`);
  }
  return body as T;
}
