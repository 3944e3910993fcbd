// Auth.js endpoints (sign-in callback, sign-out, CSRF token, session).
import { handlers } from "@/lib/auth/config";

export const { GET, POST } = handlers;
