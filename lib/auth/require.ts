// Page-level convenience: send people without the right role to where they belong.
// This is not the security boundary: every data read is scoped again in the data-access layer.
import "server-only";

import { redirect } from "next/navigation";

import type { Role } from "@/db/schema";
import { sameOriginPath } from "@/lib/http/redirect";

import { landingPath, type Actor } from "./actor";
import { getActor } from "./session";

/** returnTo: the page to come back to after signing in (e.g. the report an e-mail linked to). */
export async function requireActor(roles: readonly Role[], returnTo?: string): Promise<Actor> {
  const actor = await getActor();
  if (!actor) {
    const back = sameOriginPath(returnTo);
    redirect(back ? `/sign-in?${new URLSearchParams({ callbackUrl: back })}` : "/sign-in");
  }
  if (!roles.includes(actor.role)) redirect(landingPath(actor.role));
  return actor;
}
