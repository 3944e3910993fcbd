import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { redirect } from "next/navigation";

import { PropertyList } from "@/components/properties/property-list";
import { requireActor } from "@/lib/auth/require";
import { BOOK_PATH } from "@/lib/paths";
import { listProperties } from "@/lib/properties/queries";
import { propertyKeys } from "@/lib/properties/query-keys";
import { makeQueryClient } from "@/lib/query-client";

export const metadata: Metadata = { title: "My properties" };

/** The technician's properties. A manager's old bookmark of the book (this path, with its filters) goes to the book. */
export default async function MyPropertiesPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const actor = await requireActor(["manager", "technician"]);
  if (actor.role === "manager") {
    // Temporary on purpose: a permanent redirect is cached by the browser for this URL whoever
    // signs in next, and technicians keep their list here.
    const query = new URLSearchParams();
    for (const [k, v] of Object.entries(await searchParams))
      for (const one of Array.isArray(v) ? v : v === undefined ? [] : [v]) query.append(k, one);
    redirect(query.size ? `${BOOK_PATH}?${query}` : BOOK_PATH);
  }
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({
    queryKey: propertyKeys.list(),
    queryFn: () => listProperties(actor),
  });

  return (
    <>
      <h1 className="text-3xl font-bold">My properties</h1>
      <p className="mt-1 mb-6 text-muted">The properties assigned to you.</p>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <PropertyList showTechnician={false} />
      </HydrationBoundary>
    </>
  );
}
