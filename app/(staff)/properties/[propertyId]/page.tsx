import { ArrowLeft, PencilLine } from "lucide-react";
import type { Metadata } from "next";
import { NextIntlClientProvider } from "next-intl";
import { getMessages } from "next-intl/server";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";

import { PropertyApplications } from "@/components/applications/property-applications";
import { CheckSoonBadge } from "@/components/book/check-soon-badge";
import { PhotoFigure } from "@/components/photos/photo-figure";
import { SeasonPlan } from "@/components/programs/season-plan";
import { NitrogenToDate } from "@/components/properties/nitrogen-to-date";
import {
  AddZone,
  ArchiveProperty,
  HomeownerAdmin,
  ZoneActions,
} from "@/components/properties/property-admin";
import { PropertyHeader } from "@/components/properties/property-header";
import { ZoneList } from "@/components/properties/zone-list";
import { RiskAlertList } from "@/components/risk-alerts/risk-alert-list";
import { SeedingSection } from "@/components/seeding/seeding-section";
import { SoilTests } from "@/components/soil-tests/soil-tests";
import { PropertyIndexSection } from "@/components/sward-index/property-index-section";
import { buttonClass } from "@/components/ui/button";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { PagedList } from "@/components/ui/paged-list";
import { VisitStatusBadge } from "@/components/visits/status-badge";
import { WateringLog } from "@/components/watering/watering-log";
import { WeatherPanel } from "@/components/weather/weather-panel";
import { getNitrogenByZone, listPropertyApplications } from "@/lib/applications/queries";
import type { Actor } from "@/lib/auth/actor";
import { requireActor } from "@/lib/auth/require";
import { formatDate, todayIn } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";
import { staffClientMessages } from "@/lib/i18n/staff-messages";
import { listPendingInvitations } from "@/lib/invitations/queries";
import { BOOK_PATH, RISK_ALERTS_PATH } from "@/lib/paths";
import { listLatestPhotoPerZone } from "@/lib/photos/queries";
import { findPropertyCheckSoon } from "@/lib/pressure-areas/queries";
import { listPrograms } from "@/lib/programs/queries";
import { getSeasonPlan } from "@/lib/programs/season-plan";
import type { PropertyDetailDto } from "@/lib/properties/dto";
import { getProperty } from "@/lib/properties/queries";
import { propertyIdParams } from "@/lib/properties/schemas";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import { listPropertyAlerts } from "@/lib/risk-alerts/queries";
import { getPropertyScoreHistory } from "@/lib/scoring/queries";
import { services } from "@/lib/services";
import { listSoilTests } from "@/lib/soil-tests/queries";
import { listVisits } from "@/lib/visits/queries";
import { listWaterings } from "@/lib/watering/queries";
import { refreshPropertyWeather } from "@/lib/weather/mutations";
import { getPropertyWeather } from "@/lib/weather/queries";

export const metadata: Metadata = { title: "Property" };

export default async function PropertyPage({
  params,
}: {
  params: Promise<{ propertyId: string }>;
}) {
  const actor = await requireActor(["manager", "technician"]);
  const parsed = propertyIdParams.safeParse(await params);
  if (!parsed.success) notFound();
  const property = await getProperty(actor, parsed.data.propertyId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });
  // Checked first, streamed after: a property out of scope answers 404 before anything is sent;
  // the rest (weather refresh, histories) streams in behind the skeleton.
  return (
    <Suspense fallback={<PageSkeleton cards={4} />}>
      <PropertyBody actor={actor} property={property} />
    </Suspense>
  );
}

async function PropertyBody({ actor, property }: { actor: Actor; property: PropertyDetailDto }) {
  // The weather reads come from the cache: bring it up to date first (the other reads meanwhile).
  const [visits, latestPhotos, waterings, [weather, scores], alerts, checkSoon] = await Promise.all(
    [
      listVisits(actor, { propertyId: property.id }),
      listLatestPhotoPerZone(actor, property.id),
      listWaterings(actor, property.id),
      refreshPropertyWeather(actor, property.id).then(() =>
        Promise.all([
          getPropertyWeather(actor, property.id),
          getPropertyScoreHistory(actor, property.id),
        ]),
      ),
      listPropertyAlerts(actor, property.id),
      findPropertyCheckSoon(actor, property.id),
    ],
  );
  const year = todayIn(property.timeZone).slice(0, 4);
  const isManager = actor.role === "manager";
  const [nitrogen, applications, soilTests, messages, seasonPlan, programs] = await Promise.all([
    getNitrogenByZone(actor, property.id, year),
    listPropertyApplications(actor, property.id, year),
    listSoilTests(actor, property.id),
    getMessages(),
    getSeasonPlan(actor, property.id, services().quickWeather),
    isManager ? listPrograms(actor) : Promise.resolve([]),
  ]);
  // The page's sections, in page order, for the "On this page" links.
  const sections: [string, string][] = [
    ["alerts", "Risk alerts"],
    ["zones", "Zones"],
    ["program", "Season program"],
    ["seeding", "Crabgrass and seeding"],
    ["index", "Sward Index"],
    ...(latestPhotos.length ? ([["photos", "Photos"]] as [string, string][]) : []),
    ["visits", "Visits"],
    ["weather", "Weather and water"],
    ["applications", "Applications"],
    ["watering", "Watering log"],
    ["soil", "Soil tests"],
    ...(isManager ? ([["homeowners", "Homeowners"]] as [string, string][]) : []),
  ];
  const invitations = isManager ? await listPendingInvitations(actor, property.id) : [];

  return (
    <>
      <Link
        href={isManager ? BOOK_PATH : "/properties"}
        className="mb-4 inline-flex min-h-tap items-center gap-1 font-semibold text-sward"
      >
        <ArrowLeft className="size-5" aria-hidden="true" />
        {isManager ? "Book" : "My properties"}
      </Link>
      {property.isArchived ? (
        <p className="mb-4 rounded-lg bg-sun-tint p-3 font-semibold">
          Archived: this property is out of the book. Its history is kept.
        </p>
      ) : null}
      <PropertyHeader property={property} />
      {checkSoon ? (
        <div className="mb-4 rounded-lg bg-rain-tint p-3" role="note">
          <CheckSoonBadge />
          <p className="mt-1">
            This property lies in a {checkSoon.kindLabel.toLowerCase()} pressure area (alerts from{" "}
            {formatDate(checkSoon.firstOn)} to {formatDate(checkSoon.latestOn)}) and has had no
            visit in the last {checkSoon.days} days.{" "}
            <Link
              href={`${RISK_ALERTS_PATH}#pressure-areas`}
              className="font-semibold text-sward underline"
            >
              See the area
            </Link>
          </p>
        </div>
      ) : null}
      {isManager ? (
        <div className="mb-6 flex flex-wrap gap-2">
          <Link
            href={`/properties/${property.id}/edit`}
            className={buttonClass("secondary", "no-underline")}
          >
            <PencilLine className="size-5" aria-hidden="true" />
            Edit property
          </Link>
          <ArchiveProperty property={property} />
        </div>
      ) : null}
      <section aria-labelledby="people-title" className="mb-8 grid gap-3 sm:grid-cols-3">
        <h2 id="people-title" className="sr-only">
          People and rules
        </h2>
        <div className="rounded-xl border border-line bg-card p-4">
          <p className="text-sm font-semibold text-muted">Technician</p>
          <p className="text-lg">{property.technician?.name ?? "Not assigned"}</p>
        </div>
        <div className="rounded-xl border border-line bg-card p-4">
          <p className="text-sm font-semibold text-muted">Fertilizer rule set</p>
          <p className="text-lg">{property.ruleSet?.name ?? "None chosen"}</p>
        </div>
        <div className="rounded-xl border border-line bg-card p-4">
          <p className="text-sm font-semibold text-muted">Time zone</p>
          <p className="text-lg">{property.timeZone.replaceAll("_", " ")}</p>
        </div>
      </section>

      <nav aria-label="On this page" className="mb-8">
        <ul className="flex flex-wrap gap-2 text-sm">
          {sections.map(([id, label]) => (
            <li key={id}>
              <a
                href={`#${id}`}
                className="inline-flex min-h-tap items-center rounded-full border border-line bg-card px-3 font-semibold text-ink no-underline hover:border-sward"
              >
                {label}
              </a>
            </li>
          ))}
        </ul>
      </nav>

      <section id="alerts" aria-labelledby="alerts-title" className="mb-8 scroll-mt-4">
        <h2 id="alerts-title" className="mb-3 text-2xl font-bold">
          Risk alerts
        </h2>
        <RiskAlertList
          alerts={alerts}
          canResolve={isManager}
          timeZone={property.timeZone}
          empty="No open risk alerts for this property."
        />
      </section>

      <section id="zones" aria-labelledby="zones-title" className="scroll-mt-4">
        <h2 id="zones-title" className="mb-3 text-2xl font-bold">
          Zones
        </h2>
        <ZoneList
          zones={property.zones}
          actions={(zone) => (
            <>
              <NitrogenToDate
                nLb={nitrogen[zone.id] ?? 0}
                speciesKey={zone.grassSpecies.key}
                year={year}
              />
              <ZoneActions
                propertyId={property.id}
                zone={zone}
                canManage={isManager && !property.isArchived}
              />
            </>
          )}
        />
        {isManager && !property.isArchived ? (
          <div className="mt-3">
            <AddZone propertyId={property.id} />
          </div>
        ) : null}
      </section>

      <section id="program" aria-labelledby="program-title" className="scroll-mt-4">
        <h2 id="program-title" className="mt-10 mb-3 text-2xl font-bold">
          Season program
        </h2>
        <NextIntlClientProvider
          messages={{
            ...staffClientMessages(messages),
            terms: {
              programRoundKinds: messages.terms.programRoundKinds,
              programMethods: messages.terms.programMethods,
              planReasons: messages.terms.planReasons,
            },
          }}
        >
          <SeasonPlan
            plan={seasonPlan}
            programs={programs.map((p) => ({ id: p.id, name: p.name }))}
            canManage={isManager && !property.isArchived}
          />
        </NextIntlClientProvider>
      </section>

      <SeedingSection weather={weather} zones={property.zones} locale={actor.companyLocale} />

      <div id="index" className="mt-10 scroll-mt-4">
        <PropertyIndexSection
          history={scores}
          zoneHref={(zoneId) => `/properties/${property.id}/zones/${zoneId}`}
        />
      </div>

      {latestPhotos.length ? (
        <section id="photos" aria-labelledby="photos-title" className="scroll-mt-4">
          <h2 id="photos-title" className="mt-10 mb-3 text-2xl font-bold">
            Latest photo of each zone
          </h2>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-4" aria-label="Latest photos">
            {latestPhotos.map((photo) => (
              <li key={photo.id}>
                <p className="mb-1 font-semibold">
                  {property.zones.find((z) => z.id === photo.zoneId)?.name ?? "Archived zone"}
                </p>
                <PhotoFigure photo={photo} showDate />
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <section id="visits" aria-labelledby="visits-title" className="scroll-mt-4">
        <h2 id="visits-title" className="mt-10 mb-3 text-2xl font-bold">
          Visits
        </h2>
        {visits.length === 0 ? (
          <p className="rounded-lg border border-line bg-card p-4">
            No visits yet.{isManager ? " Schedule one from Visits." : ""}
          </p>
        ) : (
          <PagedList
            label="Visits"
            noun="visits"
            items={visits.map((v) => ({
              key: v.id,
              node: (
                <Link
                  href={`/visits/${v.id}`}
                  className="flex flex-wrap items-center justify-between gap-2 rounded-xl border border-line bg-card p-3 no-underline hover:border-sward"
                >
                  <span className="text-ink">
                    <span className="font-bold">{formatDate(v.scheduledFor)}</span> ·{" "}
                    {PLANNED_SERVICES[v.plannedService]} · {v.technician?.name ?? "no technician"}
                  </span>
                  <VisitStatusBadge status={v.status} />
                </Link>
              ),
            }))}
          />
        )}
      </section>

      <div id="weather" className="mt-10 scroll-mt-4">
        <WeatherPanel weather={weather} />
      </div>

      <section id="applications" aria-labelledby="applications-title" className="scroll-mt-4">
        <h2 id="applications-title" className="mt-10 mb-3 text-2xl font-bold">
          Applications in {year}
        </h2>
        <PropertyApplications rows={applications} year={year} />
      </section>

      <section id="watering" aria-labelledby="watering-title" className="scroll-mt-4">
        <h2 id="watering-title" className="mt-10 mb-3 text-2xl font-bold">
          Watering log
        </h2>
        <WateringLog
          propertyId={property.id}
          zones={property.zones}
          today={todayIn(property.timeZone)}
          waterings={waterings}
          canAdd={!property.isArchived}
        />
      </section>

      <section id="soil" aria-labelledby="soil-title" className="scroll-mt-4">
        <h2 id="soil-title" className="mt-10 mb-3 text-2xl font-bold">
          Soil tests
        </h2>
        <NextIntlClientProvider
          messages={{
            ...staffClientMessages(messages),
            terms: {
              soilExtractants: messages.terms.soilExtractants,
              bufferMethods: messages.terms.bufferMethods,
              soilElements: messages.terms.soilElements,
            },
          }}
        >
          <SoilTests
            propertyId={property.id}
            zones={property.zones}
            today={todayIn(property.timeZone)}
            tests={soilTests}
            canRecord={!property.isArchived}
            canDelete={isManager}
          />
        </NextIntlClientProvider>
      </section>

      {isManager ? (
        <>
          <h2 id="homeowners" className="mt-10 mb-3 scroll-mt-4 text-2xl font-bold">
            Homeowners
          </h2>
          <HomeownerAdmin property={property} invitations={invitations} />
          {property.notes ? (
            <>
              <h2 className="mt-10 mb-2 text-xl font-bold">Office notes</h2>
              <p className="rounded-lg border border-line bg-card p-4 whitespace-pre-wrap">
                {property.notes}
              </p>
            </>
          ) : null}
        </>
      ) : null}
    </>
  );
}
