import type { Metadata } from "next";
import { PropertyHeader } from "@/components/properties/property-header";
import { ZoneList } from "@/components/properties/zone-list";
import { requireActor } from "@/lib/auth/require";
import { getProperty, listProperties } from "@/lib/properties/queries";
import { LawnScore } from "@/components/scoring/lawn-score";
import { propertyScoreHistory } from "@/lib/scoring/queries";

export const metadata: Metadata = { title: "My lawn" };

export default async function MyLawnPage() {
  const actor = await requireActor(["homeowner"]);
  const summaries = await listProperties(actor);
  const properties = await Promise.all(summaries.map(async (p) => ({ ...(await getProperty(actor, p.id)), scores: await propertyScoreHistory(actor, p.id, { weather: false }) })));

  return (
    <>
      <h1 className="text-3xl font-bold">My lawn</h1>
      <p className="mb-6 mt-1 text-muted">
        Cared for by {actor.companyName}. Visit reports and care notes appear here after each visit.
      </p>
      {properties.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No property is linked to your sign-in yet. Ask {actor.companyName} to link your lawn.
        </p>
      ) : (
        properties.map((property) => (
          <section key={property.id} className="mb-10" aria-label={property.name}>
            <PropertyHeader property={property} as="h2" />
            <LawnScore history={property.scores} />
            <h3 className="mb-3 text-xl font-bold">Your lawn&apos;s zones</h3>
            <ZoneList zones={property.zones} />
          </section>
        ))
      )}
    </>
  );
}
