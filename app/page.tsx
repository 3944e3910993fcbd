// The front door: each role goes to its own landing page.
import { redirect } from "next/navigation";

import { landingPath } from "@/lib/auth/actor";
import { getActor } from "@/lib/auth/session";

export default async function Home() {
  const actor = await getActor();
  redirect(actor ? landingPath(actor.role) : "/sign-in");
}
