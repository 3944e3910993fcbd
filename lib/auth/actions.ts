"use server";

// Sign-in and sign-out server actions (public POST endpoints, built with the guard).
import { AuthError } from "next-auth";
import { headers } from "next/headers";
import { after } from "next/server";
import { z } from "zod";

import { serverEnv } from "@/lib/env";
import { AppError } from "@/lib/http/app-error";
import { sameOriginPath } from "@/lib/http/redirect";
import { log } from "@/lib/log";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";

import { clientAddress, signIn, signOut } from "./config";
import { action } from "./guards";
import { SIGN_IN_MESSAGES, signInLinkSchema, signInSchema } from "./schemas";
import { countRecentLinkRequests, issueSignInLink, recordLinkRequest } from "./sign-in-link";
import { normaliseEmail } from "./throttle";

export interface SignInState {
  email: string;
  error?: string;
  fieldErrors?: Record<string, string[]>;
}

/** Only a path on this site; anything else falls back to the role's landing page. */
const safeRedirect = (target: string | undefined): string => sameOriginPath(target) ?? "/";

const signInGuarded = action({ access: "public", input: signInSchema }, async ({ input }) => {
  try {
    await signIn("credentials", {
      email: input.email,
      password: input.password,
      redirectTo: safeRedirect(input.redirectTo),
    });
  } catch (err) {
    if (err instanceof AuthError) {
      const code = (err as AuthError & { code?: string }).code;
      throw code === "throttled"
        ? new AppError("rate_limited", SIGN_IN_MESSAGES.throttled)
        : new AppError("invalid_input", SIGN_IN_MESSAGES.invalid);
    }
    throw err; // the success redirect, or a real failure
  }
});

export async function signInAction(
  _previous: SignInState,
  formData: FormData,
): Promise<SignInState> {
  const email = String(formData.get("email") ?? "");
  const result = await signInGuarded(formData);
  if (result.ok) return { email };
  return { email, error: result.error.message, fieldErrors: result.error.fieldErrors };
}

export interface SignInLinkState {
  email: string;
  sent?: boolean;
  error?: string;
  fieldErrors?: Record<string, string[]>;
}

// Every request is counted and answered the same way whether or not the address has a homeowner
// account, so the answer reveals nothing; only a homeowner's address gets a link. The answer also
// takes the same time: looking the address up, writing the token and its e-mail all run after the
// response has been sent (Next's after()), so a homeowner's address is not slower to answer.
const requestLinkGuarded = action(
  { access: "public", input: signInLinkSchema },
  async ({ input }) => {
    const env = serverEnv();
    const emailKey = normaliseEmail(input.email);
    const address = clientAddress(await headers());
    const recent = await countRecentLinkRequests(emailKey, address, env.SIGN_IN_WINDOW_MINUTES);
    if (
      recent.forEmail >= env.SIGN_IN_LINK_MAX_PER_EMAIL ||
      recent.fromAddress >= env.SIGN_IN_LINK_MAX_PER_ADDRESS
    ) {
      log.info({ event: "sign_in_link_throttled" }, "sign-in link refused: too many requests");
      throw new AppError("rate_limited", SIGN_IN_MESSAGES.linkThrottled);
    }
    await recordLinkRequest(emailKey, address);
    const redirectTo = safeRedirect(input.redirectTo);
    after(async () => {
      try {
        if (await issueSignInLink(emailKey, redirectTo)) deliverMailAfterResponse("sign_in_link");
      } catch (err) {
        log.error({ err }, "sign-in link could not be issued");
      }
    });
    log.info({ event: "sign_in_link_requested" }, "sign-in link requested");
  },
);

export async function requestSignInLinkAction(
  _previous: SignInLinkState,
  formData: FormData,
): Promise<SignInLinkState> {
  const email = String(formData.get("email") ?? "").slice(0, 320);
  const result = await requestLinkGuarded(formData);
  if (result.ok) return { email, sent: true };
  return { email, error: result.error.message, fieldErrors: result.error.fieldErrors };
}

const signOutGuarded = action({ access: "public", input: z.object({}).loose() }, async () => {
  await signOut({ redirectTo: "/sign-in" });
});

export async function signOutAction(): Promise<void> {
  await signOutGuarded({});
}
