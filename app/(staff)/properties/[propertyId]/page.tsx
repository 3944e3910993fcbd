import { ArrowLeft } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PropertyHeader } from "@/components/properties/property-header";
import { ZoneList } from "@/components/properties/zone-list";
import { requireActor } from "@/lib/auth/require";
import { AppError } from "@/lib/http/app-error";
import { getProperty } from "@/lib/properties/queries";
import { propertyIdParams } from "@/lib/properties/schemas";

export const metadata: Metadata = { title: "Property" };

export default async function PropertyPage({ params }: { params: Promise<{ propertyId: string }> }) {
  const actor = await requireActor(["manager", "technician"]);
  const parsed = propertyIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  const property = await getProperty(actor, parsed.data.propertyId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });

  return (
    <>
      <Link href="/properties" className="mb-4 inline-flex min-h-tap items-center gap-1 font-semibold text-sward">
        <ArrowLeft className="size-5" aria-hidden="true" />
        All properties
      </Link>
      <PropertyHeader property={property} />
      <section aria-labelledby="people-title" className="mb-8 grid gap-3 sm:grid-cols-2">
        <h2 id="people-title" className="sr-only">
          People
        </h2>
        <div className="rounded-xl border border-line bg-card p-4">
          <p className="text-sm font-semibold text-muted">Technician</p>
          <p className="text-lg">{property.technician?.name ?? "Not assigned"}</p>
        </div>
        <div className="rounded-xl border border-line bg-card p-4">
          <p className="text-sm font-semibold text-muted">Homeowner sign-ins</p>
          <p className="text-lg">{property.homeowners.length ? property.homeowners.map((h) => h.name).join(", ") : "None yet"}</p>
        </div>
      </section>
      <h2 className="mb-3 text-2xl font-bold">Zones</h2>
      <ZoneList zones={property.zones} />
    </>
  );
}
