// Name, address and lawn size of a property.
import { MapPin } from "lucide-react";

import { formatAreaFt2, formatCount } from "@/components/ui/format";
import type { PropertyDetailDto } from "@/lib/properties/dto";

export function PropertyHeader({
  property,
  as: Heading = "h1",
}: {
  property: PropertyDetailDto;
  as?: "h1" | "h2";
}) {
  const { address } = property;
  return (
    <header className="mb-6">
      <Heading className={Heading === "h1" ? "text-3xl font-bold" : "text-2xl font-bold"}>
        {property.name}
      </Heading>
      <p className="mt-1 flex items-center gap-1.5 text-muted">
        <MapPin className="size-4 shrink-0" aria-hidden="true" />
        {address.street}, {address.city}, {address.region} {address.postalCode}
      </p>
      <p className="mt-2">
        {formatCount(property.zoneCount, "zone", "zones")} · {formatAreaFt2(property.lawnAreaFt2)}{" "}
        of lawn
      </p>
    </header>
  );
}
