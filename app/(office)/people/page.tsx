import type { Metadata } from "next";

import { PeopleAdmin } from "@/components/people/people-admin";
import { requireActor } from "@/lib/auth/require";
import { getPeopleDirectory } from "@/lib/people/queries";

export const metadata: Metadata = { title: "People" };

// The company's people (managers only): managers, technicians with their applicator licenses,
// homeowners with their properties, and pending invitations.
export default async function PeoplePage() {
  const actor = await requireActor(["manager"]);
  const directory = await getPeopleDirectory(actor);
  return (
    <>
      <h1 className="text-3xl font-bold">People</h1>
      <p className="mt-1 mb-6 max-w-prose text-muted">
        Everyone at {actor.companyName} and the homeowners who follow their lawns: invite staff,
        change a role, disable an account, and keep technicians&rsquo; applicator licenses.
      </p>
      <PeopleAdmin directory={directory} locale={actor.companyLocale} />
    </>
  );
}
