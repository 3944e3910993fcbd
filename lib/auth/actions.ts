"use server";
// Sign-in and sign-out server actions (public POST endpoints, built with the guard).
import { AuthError } from "next-auth";
import { z } from "zod";
import { AppError } from "@/lib/http/app-error";
import { signIn, signOut } from "./config";
import { action } from "./guards";
import { SIGN_IN_MESSAGES, signInSchema } from "./schemas";

export interface SignInState {
  email: string;
  error?: string;
  fieldErrors?: Record<string, string[]>;
}

/** Only a path on this site; anything else falls back to the role's landing page. */
function safeRedirect(target: string | undefined): string {
  return target && target.startsWith("/") && !target.startsWith("//") && !target.startsWith("/\\") ? target : "/";
}

const signInGuarded = action({ access: "public", input: signInSchema }, async ({ input }) => {
  try {
    await signIn("credentials", { email: input.email, password: input.password, redirectTo: safeRedirect(input.redirectTo) });
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

export async function signInAction(_previous: SignInState, formData: FormData): Promise<SignInState> {
  const email = String(formData.get("email") ?? "");
  const result = await signInGuarded(formData);
  if (result.ok) return { email };
  return { email, error: result.error.message, fieldErrors: result.error.fieldErrors };
}

const signOutGuarded = action({ access: "public", input: z.object({}).loose() }, async () => {
  await signOut({ redirectTo: "/sign-in" });
});

export async function signOutAction(): Promise<void> {
  await signOutGuarded({});
}
