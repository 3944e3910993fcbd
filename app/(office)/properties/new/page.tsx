import type { Metadata } from "next";

import { PropertyForm } from "@/components/properties/property-form";
import { requireActor } from "@/lib/auth/require";
import { listPeople } from "@/lib/people/queries";
import { listRuleSets } from "@/lib/rule-sets/queries";
import { timeZoneChoices } from "@/lib/time-zones";

export const metadata: Metadata = { title: "New property" };

export default async function NewPropertyPage() {
  const actor = await requireActor(["manager"]);
  const [technicians, ruleSets] = await Promise.all([
    listPeople(actor, "technician"),
    listRuleSets(actor),
  ]);
  return (
    <>
      <h1 className="mb-6 text-3xl font-bold">New property</h1>
      <PropertyForm
        technicians={technicians.filter((t) => !t.isDisabled)}
        ruleSets={ruleSets}
        timeZones={timeZoneChoices()}
      />
    </>
  );
}
