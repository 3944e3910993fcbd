// The property's Sward Index through the season, the weather on the same dates, and each zone's
// latest Index with its trend and how it moved with nitrogen (staff property page).
import Link from "next/link";

import { ChartFigure, Td, Th } from "@/components/charts/chart-figure";
import { IndexChart } from "@/components/charts/index-chart";
import { WeatherStrip } from "@/components/charts/weather-strip";
import { formatDate } from "@/lib/dates";
import type { PropertyScoreHistory } from "@/lib/scoring/dto";
import { MIN_CHECKS_FOR_CORRELATION } from "@/lib/scoring/history";
import {
  coefficient,
  patternPhrase,
  pValue,
  seasonSentence,
  trendSentence,
} from "@/lib/scoring/words";

import { TrendBadge } from "./trend-badge";

const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);

/** The first and last visits with photos, for the before/after markers. */
export function beforeAfterOf(points: { date: string; hasPhoto: boolean }[]) {
  const withPhotos = points.filter((p) => p.hasPhoto);
  return withPhotos.length >= 2
    ? { before: withPhotos[0]!.date, after: withPhotos.at(-1)!.date }
    : null;
}

export function PropertyIndexSection({
  history,
  zoneHref,
}: {
  history: PropertyScoreHistory;
  zoneHref: (zoneId: string) => string;
}) {
  const { visits, applications, weather, from, today } = history;
  const latest = visits.at(-1);
  const totalN = sum(applications.map((a) => a.nLb));
  const days = weather.days;
  // Weekly rows for the weather table (a day per row would be a long read).
  const weeks: { from: string; to: string; rainIn: number; et0In: number; gddF: number }[] = [];
  for (let i = 0; i < days.length; i += 7) {
    const block = days.slice(i, i + 7);
    weeks.push({
      from: block[0]!.date,
      to: block.at(-1)!.date,
      rainIn: sum(block.map((d) => d.rainIn)),
      et0In: sum(block.map((d) => d.et0In)),
      gddF: sum(block.map((d) => d.gddF)),
    });
  }

  return (
    <section aria-labelledby="index-title" className="space-y-4">
      <h2 id="index-title" className="text-2xl font-bold">
        Sward Index
      </h2>
      {visits.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No rated checks yet: the Index appears after the first visit.
        </p>
      ) : (
        <>
          <ChartFigure
            id="property-index"
            title="Property index over time"
            tableCaption="Property index per visit"
            summary={
              <>
                <p>
                  Latest <strong>{Math.round(latest!.index)}</strong> on {formatDate(latest!.date)}{" "}
                  ({latest!.zonesChecked} {latest!.zonesChecked === 1 ? "zone" : "zones"} checked,
                  weighted by area). {trendSentence(history.trend)} {seasonSentence(history.season)}
                </p>
                <p className="text-sm text-muted">
                  Dashed lines: nitrogen applied, lb N per 1,000 ft² averaged over the lawn (
                  {applications.length} {applications.length === 1 ? "feeding" : "feedings"},{" "}
                  {totalN.toFixed(2)} in all). Ringed points: visits with photos; “before” and
                  “after” mark the first and latest of them.
                </p>
              </>
            }
            chart={
              <IndexChart
                label="Property index over time"
                from={from}
                to={today}
                points={visits}
                feedings={applications}
                beforeAfter={beforeAfterOf(visits)}
              />
            }
            table={
              <>
                <thead>
                  <tr>
                    <Th>Visit</Th>
                    <Th>Property index</Th>
                    <Th>Zones checked</Th>
                    <Th>Photos</Th>
                    <Th>N applied (lb / 1,000 ft²)</Th>
                  </tr>
                </thead>
                <tbody>
                  {visits.map((v) => (
                    <tr key={v.visitId}>
                      <Td>
                        <Link href={`/visits/${v.visitId}`} className="font-semibold text-sward">
                          {formatDate(v.date)}
                        </Link>
                      </Td>
                      <Td className="font-bold">{Math.round(v.index)}</Td>
                      <Td>{v.zonesChecked}</Td>
                      <Td>{v.hasPhoto ? "yes" : "—"}</Td>
                      <Td>{applications.find((a) => a.date === v.date)?.nLb.toFixed(2) ?? "—"}</Td>
                    </tr>
                  ))}
                </tbody>
              </>
            }
          />
          <ChartFigure
            id="weather-strip"
            title="Weather on the same dates"
            tableCaption="Weather by week"
            summary={
              weather.status === "unavailable" || days.length === 0 ? (
                <p>{weather.message ?? "Weather unavailable."}</p>
              ) : (
                <p>
                  From {formatDate(days[0]!.date)}: {sum(days.map((d) => d.rainIn)).toFixed(1)} in
                  of rain, {sum(days.map((d) => d.et0In)).toFixed(1)} in of reference ET,{" "}
                  {Math.round(sum(days.map((d) => d.gddF))).toLocaleString("en-US")} growing degree
                  days (base 50 °F).
                  {weather.status === "cached"
                    ? " Showing the weather Sward kept; the service is not answering."
                    : ""}
                  <span className="block text-sm text-muted">
                    Top: rain (blue bars) and reference ET (brown line), inches per day. Bottom:
                    growing degree days per day.
                  </span>
                </p>
              )
            }
            chart={
              days.length ? (
                <WeatherStrip label="Weather" from={from} to={today} days={days} />
              ) : null
            }
            table={
              <>
                <thead>
                  <tr>
                    <Th>Week</Th>
                    <Th>Rain (in)</Th>
                    <Th>Reference ET (in)</Th>
                    <Th>GDD (°F, base 50)</Th>
                  </tr>
                </thead>
                <tbody>
                  {weeks.map((w) => (
                    <tr key={w.from}>
                      <Td>
                        {formatDate(w.from)} – {formatDate(w.to)}
                      </Td>
                      <Td>{w.rainIn.toFixed(2)}</Td>
                      <Td>{w.et0In.toFixed(2)}</Td>
                      <Td>{Math.round(w.gddF)}</Td>
                    </tr>
                  ))}
                </tbody>
              </>
            }
          />
        </>
      )}
      <h3 className="text-xl font-bold">Index by zone</h3>
      <ul className="grid gap-3 sm:grid-cols-2" aria-label="Zone index">
        {history.zones.map((z) => {
          const last = z.points.at(-1);
          const c = z.correlations;
          return (
            <li key={z.zoneId} className="rounded-xl border border-line bg-card p-4">
              <div className="flex items-baseline justify-between gap-2">
                <Link href={zoneHref(z.zoneId)} className="text-lg font-bold text-sward">
                  {z.name}
                </Link>
                <span className="text-2xl font-bold">{last ? Math.round(last.index) : "—"}</span>
              </div>
              <p className="mt-1 flex flex-wrap items-center gap-2">
                <TrendBadge word={z.trend?.word ?? null} n={z.trend?.n ?? 0} />
                {z.trend && z.trend.word ? (
                  <span className="text-sm text-muted">
                    {z.trend.slopePer30Days >= 0 ? "+" : "−"}
                    {Math.abs(z.trend.slopePer30Days).toFixed(1)} / 30 days
                  </span>
                ) : null}
                {z.season ? (
                  <span className="text-sm text-muted">
                    · {z.season.change >= 0 ? "+" : "−"}
                    {Math.abs(Math.round(z.season.change))} this season
                  </span>
                ) : null}
              </p>
              <p className="mt-2 text-sm">
                {c.n < MIN_CHECKS_FOR_CORRELATION
                  ? `Nitrogen pattern: not enough visits yet (${c.n} of ${MIN_CHECKS_FOR_CORRELATION} checks).`
                  : c.nitrogen
                    ? `Nitrogen: ${patternPhrase(c.nitrogen)} (r ${coefficient(c.nitrogen.pearson)}, ${pValue(c.nitrogen.pPearson)}, n ${c.nitrogen.n}).`
                    : "Nitrogen: no feeding variation to compare."}
              </p>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
