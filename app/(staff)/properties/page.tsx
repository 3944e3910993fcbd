import { HydrationBoundary, dehydrate } from "@tanstack/react-query";
import { Plus } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { PropertyList } from "@/components/properties/property-list";
import { requireActor } from "@/lib/auth/require";
import { listProperties } from "@/lib/properties/queries";
import { propertyKeys } from "@/lib/properties/query-keys";
import { makeQueryClient } from "@/lib/query-client";
import { BookSummary } from "@/components/scoring/book-summary";
import { bookScoring } from "@/lib/scoring/queries";

export const metadata: Metadata = { title: "Properties" };

export default async function PropertiesPage() {
  const actor = await requireActor(["manager", "technician"]);
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({ queryKey: propertyKeys.list(), queryFn: () => listProperties(actor) });
  const isManager = actor.role === "manager";
  const book = isManager ? await bookScoring(actor) : null;

  return (
    <>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-3xl font-bold">{isManager ? "Properties" : "My properties"}</h1>
        {isManager ? (
          <Link href="/properties/new" className={buttonClass("primary", "no-underline")}>
            <Plus className="size-5" aria-hidden="true" />
            Add property
          </Link>
        ) : null}
      </div>
      <p className="mb-6 mt-1 text-muted">
        {isManager ? `Every property ${actor.companyName} serves.` : "The properties assigned to you."}
      </p>
      {book ? <BookSummary book={book} /> : null}
      <HydrationBoundary state={dehydrate(queryClient)}>
        <PropertyList showTechnician={isManager} />
      </HydrationBoundary>
    </>
  );
}
