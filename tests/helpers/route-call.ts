// Calling a route handler as the browser would: a same-site JSON request (the guard refuses
// cross-site writes), its params, and the answer's status and JSON body. The file under test mocks
// the session (`vi.mock("@/lib/auth/session", …)`) to choose who is signed in.
type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;

export interface RouteAnswer<B = Record<string, unknown>> {
  status: number;
  body: B & {
    error?: {
      code: string;
      message: string;
      fieldErrors?: Record<string, string[]>;
      details?: Record<string, unknown>;
    };
  };
}

export async function callRoute<B = Record<string, unknown>>(
  handler: Handler,
  body: unknown,
  {
    method = "POST",
    params = {},
    query = "",
  }: { method?: string; params?: Record<string, string>; query?: string } = {},
): Promise<RouteAnswer<B>> {
  const res = await handler(
    new Request(`http://localhost/api${query ? `?${query}` : ""}`, {
      method,
      body: method === "GET" ? undefined : JSON.stringify(body),
      headers: {
        origin: "http://localhost:3000",
        host: "localhost",
        "content-type": "application/json",
      },
    }),
    { params: Promise.resolve(params) },
  );
  const text = await res.text();
  return { status: res.status, body: (text ? JSON.parse(text) : {}) as RouteAnswer<B>["body"] };
}
