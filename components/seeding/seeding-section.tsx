// The property's crabgrass pre-emergence timing (GDD from its daily weather) and each zone's seed
// rates with the seed to load, beside the seeding window from the estimated soil temperature.
// Stages and rates are computed in lib/agronomy (crabgrass.ts, seeding.ts); words from the
// catalogue (seeding.*). Severity is said in words and an icon as well as colour.
import { CircleCheck, Clock, Sprout, TriangleAlert } from "lucide-react";
import { getTranslations } from "next-intl/server";

import type { CrabgrassStage } from "@/lib/agronomy/crabgrass";
import { GERMINATION_SOIL_F, seedingWindow, seedRate, seedToLoadLb } from "@/lib/agronomy/seeding";
import { formatDate } from "@/lib/dates";
import type { ZoneDto } from "@/lib/properties/dto";
import type { PropertyWeather } from "@/lib/weather/dto";

const STAGE_LOOK: Record<CrabgrassStage, { box: string; Icon: typeof Clock }> = {
  early: { box: "border-line bg-card", Icon: Clock },
  apply_now: { box: "border-sward bg-sward-tint", Icon: CircleCheck },
  closing: { box: "border-sun bg-sun-tint", Icon: TriangleAlert },
  too_late: { box: "border-clay bg-clay-tint", Icon: TriangleAlert },
};

export async function SeedingSection({
  weather,
  zones,
  locale,
}: {
  weather: PropertyWeather;
  zones: ZoneDto[];
  locale?: string;
}) {
  const t = await getTranslations("seeding");
  const c = weather.crabgrass;
  const look = c ? STAGE_LOOK[c.stage] : null;
  const soil = weather.soilTempEstimateF;
  const seasons = [...new Set(zones.map((z) => z.grassSpecies.season ?? "cool"))];
  return (
    <section id="seeding" aria-labelledby="seeding-title" className="mt-10 scroll-mt-4 space-y-4">
      <h2 id="seeding-title" className="text-2xl font-bold">
        {t("crabgrassTitle")} · {t("seedTitle")}
      </h2>
      <div
        className={`rounded-xl border-2 p-4 ${look?.box ?? "border-line bg-card"}`}
        data-crabgrass-stage={c?.stage ?? "none"}
      >
        <h3 className="text-sm font-semibold text-muted">{t("crabgrassTitle")}</h3>
        {c && look ? (
          <>
            <p className="mt-1 flex items-center gap-2 text-xl font-bold">
              <look.Icon className="size-6 shrink-0" aria-hidden="true" />
              {t(`stage.${c.stage}`)}
            </p>
            <p className="mt-2">{t(`stageDetail.${c.stage}`)}</p>
            <ul className="mt-3 space-y-1 text-sm tabular-nums">
              <li>{t("gdd50", { gdd: c.gdd50 })}</li>
              <li>{t("gdd32", { gdd: c.gdd32 })}</li>
              {c.openedOn ? <li>{t("opened", { date: formatDate(c.openedOn, locale) })}</li> : null}
              {c.closingOn ? (
                <li>{t("closing", { date: formatDate(c.closingOn, locale) })}</li>
              ) : null}
              {c.lateOn ? <li>{t("late", { date: formatDate(c.lateOn, locale) })}</li> : null}
            </ul>
            <p className="mt-2 text-sm text-muted">
              {t("asOf", { date: formatDate(c.asOf, locale) })}
            </p>
            {c.missingDays > 0 ? (
              <p className="mt-1 text-sm font-semibold">{t("missing", { count: c.missingDays })}</p>
            ) : null}
          </>
        ) : (
          <p className="mt-1">{t("noWeather")}</p>
        )}
        <p className="mt-3 text-sm text-muted">{t("sources")}</p>
      </div>

      <div className="rounded-xl border border-line bg-card p-4" data-seeding-card>
        <h3 className="flex items-center gap-2 text-lg font-bold">
          <Sprout className="size-5 text-sward" aria-hidden="true" />
          {t("seedTitle")}
        </h3>
        <p className="mt-2 text-sm">{soil === null ? t("soilNone") : t("soil", { temp: soil })}</p>
        {soil !== null ? (
          <ul className="mt-1 space-y-1 text-sm font-semibold">
            {seasons.map((season) => (
              <li key={season}>
                {t(`window.${seedingWindow(soil, season)}`, {
                  min: GERMINATION_SOIL_F[season].min,
                  max: GERMINATION_SOIL_F[season].max,
                })}
              </li>
            ))}
          </ul>
        ) : null}
        <ul className="mt-3 space-y-2 text-sm tabular-nums">
          {zones.map((z) => {
            const o = seedRate(z.grassSpecies.key, "overseed");
            const n = seedRate(z.grassSpecies.key, "new");
            return (
              <li key={z.id} data-zone-seed-rate={z.id}>
                {o && n
                  ? t("zoneRate", {
                      zone: z.name,
                      species: z.grassSpecies.name,
                      area: z.areaFt2,
                      oMin: o.min,
                      oMax: o.max,
                      oLoadMin: seedToLoadLb(o.min, z.areaFt2),
                      oLoadMax: seedToLoadLb(o.max, z.areaFt2),
                      nMin: n.min,
                      nMax: n.max,
                      nLoadMin: seedToLoadLb(n.min, z.areaFt2),
                      nLoadMax: seedToLoadLb(n.max, z.areaFt2),
                    })
                  : t("zoneNoSeed", { zone: z.name, species: z.grassSpecies.name })}
              </li>
            );
          })}
        </ul>
        <p className="mt-3 rounded-lg bg-sun-tint p-3 text-sm">
          <TriangleAlert className="mr-1 inline size-4 text-sun" aria-hidden="true" />
          {t("preEmergenceWarning")}
        </p>
        <p className="mt-2 text-sm text-muted">{t("seedSources")}</p>
      </div>
    </section>
  );
}
