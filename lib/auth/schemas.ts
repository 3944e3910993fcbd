// Shared by the sign-in form (client) and the sign-in action (server).
import { z } from "zod";

export const signInSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, "Enter your e-mail address.")
    .max(320)
    .pipe(z.email("Enter a valid e-mail address.")),
  password: z.string().min(1, "Enter your password.").max(1024, "That password is too long."),
  redirectTo: z.string().max(500).optional(),
});

export const signInLinkSchema = z.object({
  email: z
    .string()
    .trim()
    .min(1, "Enter your e-mail address.")
    .max(320)
    .pipe(z.email("Enter a valid e-mail address.")),
  redirectTo: z.string().max(500).optional(),
});

export const SIGN_IN_MESSAGES = {
  invalid: "That e-mail and password do not match an account. Check both and try again.",
  throttled: "Too many sign-in attempts. Wait 15 minutes, then try again.",
  linkThrottled:
    "Too many sign-in links were asked for. Wait 15 minutes, then ask again — or use the link already in your inbox.",
} as const;
