import type { Metadata } from "next";
import { notFound } from "next/navigation";

import { PropertyForm } from "@/components/properties/property-form";
import { requireActor } from "@/lib/auth/require";
import { AppError } from "@/lib/http/app-error";
import { listPeople } from "@/lib/people/queries";
import { getProperty } from "@/lib/properties/queries";
import { propertyIdParams } from "@/lib/properties/schemas";
import { listRuleSets } from "@/lib/rule-sets/queries";
import { timeZoneChoices } from "@/lib/time-zones";

export const metadata: Metadata = { title: "Edit property" };

export default async function EditPropertyPage({
  params,
}: {
  params: Promise<{ propertyId: string }>;
}) {
  const actor = await requireActor(["manager"]);
  const parsed = propertyIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  const property = await getProperty(actor, parsed.data.propertyId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });
  const [technicians, ruleSets] = await Promise.all([
    listPeople(actor, "technician"),
    listRuleSets(actor),
  ]);
  return (
    <>
      <h1 className="mb-6 text-3xl font-bold">Edit {property.name}</h1>
      <PropertyForm
        property={property}
        technicians={technicians.filter((t) => !t.isDisabled || t.id === property.technician?.id)}
        ruleSets={ruleSets}
        timeZones={timeZoneChoices()}
      />
    </>
  );
}
