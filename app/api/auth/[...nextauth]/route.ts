// Auth.js endpoints (sign-in callbacks, sign-out, CSRF token, session). Sign-in links are asked
// for only through the sign-in page's action, which throttles them; Auth.js's own POST for that is
// closed so it cannot be used to send mail around the throttle.
import { handlers } from "@/lib/auth/config";
import { SIGN_IN_LINK_PROVIDER } from "@/lib/auth/sign-in-link";

export const GET = handlers.GET;

export async function POST(
  request: Request & Parameters<typeof handlers.POST>[0],
): Promise<Response> {
  const { pathname } = new URL(request.url);
  if (pathname.endsWith(`/signin/${SIGN_IN_LINK_PROVIDER}`)) {
    return Response.json(
      { error: { code: "not_found", message: "Ask for a sign-in link on the sign-in page." } },
      { status: 404 },
    );
  }
  return handlers.POST(request);
}
