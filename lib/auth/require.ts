// Page-level convenience: send people without the right role to where they belong.
// This is not the security boundary: every data read is scoped again in the data-access layer.
import "server-only";
import { redirect } from "next/navigation";
import type { Role } from "@/db/schema";
import { type Actor, landingPath } from "./actor";
import { getActor } from "./session";

export async function requireActor(roles: readonly Role[]): Promise<Actor> {
  const actor = await getActor();
  if (!actor) redirect("/sign-in");
  if (!roles.includes(actor.role)) redirect(landingPath(actor.role));
  return actor;
}
