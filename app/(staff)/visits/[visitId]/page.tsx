import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";
import { NextIntlClientProvider } from "next-intl";
import { getMessages } from "next-intl/server";
import { notFound } from "next/navigation";
import { Suspense } from "react";

import { RiskAlertList } from "@/components/risk-alerts/risk-alert-list";
import { VisitRunner } from "@/components/visits/visit-runner";
import type { Actor } from "@/lib/auth/actor";
import { requireActor } from "@/lib/auth/require";
import { AppError } from "@/lib/http/app-error";
import { staffClientMessages } from "@/lib/i18n/staff-messages";
import { getRememberedApplicator } from "@/lib/people/queries";
import { meKeys } from "@/lib/people/query-keys";
import { makeQueryClient } from "@/lib/query-client";
import { listPropertyAlerts } from "@/lib/risk-alerts/queries";
import { getVisit } from "@/lib/visits/queries";
import { visitKeys } from "@/lib/visits/query-keys";
import { visitIdParams } from "@/lib/visits/schemas";
import { fillVisitWeather } from "@/lib/weather/mutations";

export const metadata: Metadata = { title: "Visit" };

export default async function VisitPage({ params }: { params: Promise<{ visitId: string }> }) {
  const actor = await requireActor(["manager", "technician"]);
  const parsed = visitIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  // Checked first: a visit out of scope answers 404 before the day's weather is fetched.
  await getVisit(actor, parsed.data.visitId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });
  // Rendered with the page, not streamed (as Today): the visit runner is the field app's screen.
  return <VisitBody actor={actor} visitId={parsed.data.visitId} />;
}

async function VisitBody({ actor, visitId }: { actor: Actor; visitId: string }) {
  await fillVisitWeather(actor, visitId).catch(() => undefined);
  const visit = await getVisit(actor, visitId);
  const alerts = (await listPropertyAlerts(actor, visit.propertyId)).filter(
    (a) => a.status !== "resolved",
  );
  const messages = await getMessages();
  const queryClient = makeQueryClient();
  queryClient.setQueryData(visitKeys.detail(visit.id), visit);
  queryClient.setQueryData(meKeys.applicator(), await getRememberedApplicator(actor));

  return (
    <HydrationBoundary state={dehydrate(queryClient)}>
      <Suspense>
        {/* The seed-rate hint of the application form reads the catalogue on the client; the
            outbox's words stay (a nested provider's messages replace the layout's). */}
        <NextIntlClientProvider
          messages={{
            ...staffClientMessages(messages),
            seeding: { formHint: messages.seeding.formHint },
          }}
        >
          <VisitRunner
            visitId={visit.id}
            isManager={actor.role === "manager"}
            alerts={
              <section aria-labelledby="visit-alerts-title" className="mb-6">
                <h2 id="visit-alerts-title" className="mb-2 text-xl font-bold">
                  Risk alerts for this property
                </h2>
                <RiskAlertList
                  alerts={alerts}
                  canResolve={actor.role === "manager"}
                  timeZone={visit.timeZone}
                  empty="Nothing raised: no open risk alerts for this property."
                />
              </section>
            }
          />
        </NextIntlClientProvider>
      </Suspense>
    </HydrationBoundary>
  );
}
