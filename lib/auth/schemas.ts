// Shared by the sign-in form (client) and the sign-in action (server).
import { z } from "zod/mini";

export const signInSchema = z.object({
  email: z.pipe(
    z.string().check(z.trim(), z.minLength(1, "Enter your e-mail address."), z.maxLength(320)),
    z.email("Enter a valid e-mail address."),
  ),
  password: z
    .string()
    .check(z.minLength(1, "Enter your password."), z.maxLength(1024, "That password is too long.")),
  redirectTo: z.optional(z.string().check(z.maxLength(500))),
});

export const signInLinkSchema = z.object({
  email: z.pipe(
    z.string().check(z.trim(), z.minLength(1, "Enter your e-mail address."), z.maxLength(320)),
    z.email("Enter a valid e-mail address."),
  ),
  redirectTo: z.optional(z.string().check(z.maxLength(500))),
});

export const SIGN_IN_MESSAGES = {
  invalid: "That e-mail and password do not match an account. Check both and try again.",
  throttled: "Too many sign-in attempts. Wait 15 minutes, then try again.",
  linkThrottled:
    "Too many sign-in links were asked for. Wait 15 minutes, then ask again — or use the link already in your inbox.",
} as const;
