"use server";

// The invited person's confirmation (a public server action, built with the guard; the form works
// before its script loads). A new account is signed in with the password just chosen; an existing
// homeowner account goes on to My lawn (signing in first when this browser is not theirs); a new
// technician or manager lands where their role does (Today, the book).
import { AuthError } from "next-auth";
import { redirect } from "next/navigation";

import { landingPath } from "@/lib/auth/actor";
import { signIn } from "@/lib/auth/config";
import { action } from "@/lib/auth/guards";
import { log } from "@/lib/log";

import { acceptInvitation } from "./mutations";
import { acceptInvitationSchema } from "./schemas";

export interface AcceptInvitationState {
  name: string;
  error?: string;
  fieldErrors?: Record<string, string[]>;
}

const acceptGuarded = action(
  { access: "public", input: acceptInvitationSchema },
  async ({ actor, input }) => {
    const accepted = await acceptInvitation(input.token, {
      name: input.name,
      password: input.password,
    });
    log.info(
      {
        event: "invitation_accepted",
        createdAccount: accepted.createdAccount,
        role: accepted.role,
      },
      "invitation accepted",
    );
    const landing = landingPath(accepted.role);
    if (accepted.createdAccount && input.password) {
      try {
        await signIn("credentials", {
          email: accepted.email,
          password: input.password,
          redirectTo: landing,
        });
      } catch (err) {
        // The account exists and the property is linked; a refused sign-in (e.g. throttled) only
        // means signing in by hand.
        if (!(err instanceof AuthError)) throw err;
      }
    }
    redirect(
      actor?.userId === accepted.userId
        ? landing
        : `/sign-in?callbackUrl=${encodeURIComponent(landing)}`,
    );
  },
);

export async function acceptInvitationAction(
  _previous: AcceptInvitationState,
  formData: FormData,
): Promise<AcceptInvitationState> {
  const name = String(formData.get("name") ?? "").slice(0, 200);
  const result = await acceptGuarded(formData);
  if (result.ok) return { name };
  return { name, error: result.error.message, fieldErrors: result.error.fieldErrors };
}
