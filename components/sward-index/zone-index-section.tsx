// A zone's Index through the season with its feedings, watering and photos, and how the Index
// moved with the nitrogen and water before each check — with the caution that goes with it.
import { ChartFigure, Td, Th } from "@/components/charts/chart-figure";
import { IndexChart } from "@/components/charts/index-chart";
import { formatDate } from "@/lib/dates";
import type { ZoneScoreHistory } from "@/lib/scoring/dto";
import {
  MIN_CHECKS_FOR_CORRELATION,
  NITROGEN_WINDOW_DAYS,
  RESPONDS_TO_N_R,
} from "@/lib/scoring/history";
import { correlationSentence, seasonSentence, trendSentence } from "@/lib/scoring/words";

import { beforeAfterOf } from "./property-index-section";

export function ZoneIndexSection({
  zone,
  from,
  to,
}: {
  zone: ZoneScoreHistory;
  from: string;
  to: string;
}) {
  const c = zone.correlations;
  const totalN = zone.applications.reduce((s, a) => s + a.nLb, 0);
  const totalWater = zone.waterings.reduce((s, w) => s + w.wateringIn, 0);
  return (
    <section aria-labelledby="zone-index-title" className="space-y-4">
      <h2 id="zone-index-title" className="text-2xl font-bold">
        Sward Index
      </h2>
      {zone.points.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">No rated checks yet.</p>
      ) : (
        <ChartFigure
          id="zone-index"
          title={`${zone.name}: Index, feeding and watering`}
          tableCaption={`${zone.name}: Index per check`}
          summary={
            <>
              <p>
                Latest <strong>{Math.round(zone.points.at(-1)!.index)}</strong> on{" "}
                {formatDate(zone.points.at(-1)!.date)}. {trendSentence(zone.trend)}{" "}
                {seasonSentence(zone.season)}
              </p>
              <p className="text-sm text-muted">
                Dashed lines: nitrogen applied, lb N per 1,000 ft² ({zone.applications.length}{" "}
                {zone.applications.length === 1 ? "application" : "applications"},{" "}
                {totalN.toFixed(2)} in all). Blue bars below:{" "}
                {zone.waterings.length
                  ? `watering, ${totalWater.toFixed(1)} in over ${zone.waterings.length} days`
                  : "no watering logged"}
                . Ringed points: checks with photos.
              </p>
            </>
          }
          chart={
            <IndexChart
              label={`${zone.name}: Sward Index over time`}
              from={from}
              to={to}
              points={zone.points}
              feedings={zone.applications}
              waterings={zone.waterings}
              beforeAfter={beforeAfterOf(zone.points)}
            />
          }
          table={
            <>
              <thead>
                <tr>
                  <Th>Check</Th>
                  <Th>Index</Th>
                  <Th>N available before (lb / 1,000 ft²)</Th>
                  <Th>Water balance, 14 days before (in)</Th>
                  <Th>Photo</Th>
                </tr>
              </thead>
              <tbody>
                {c.pairs.map((p, i) => (
                  <tr key={`${p.date}-${i}`}>
                    <Td>{formatDate(p.date)}</Td>
                    <Td className="font-bold">{Math.round(p.index)}</Td>
                    <Td>{p.availableNLb.toFixed(2)}</Td>
                    <Td>
                      {p.balance14In === null
                        ? "—"
                        : `${p.balance14In >= 0 ? "+" : "−"}${Math.abs(p.balance14In).toFixed(2)}`}
                    </Td>
                    <Td>{zone.points[i]?.hasPhoto ? "yes" : "—"}</Td>
                  </tr>
                ))}
              </tbody>
            </>
          }
        />
      )}
      <div
        className="rounded-xl border border-line bg-card p-4"
        aria-labelledby="correlation-title"
      >
        <h3 id="correlation-title" className="text-lg font-bold">
          Index beside feeding and water
        </h3>
        {c.n < MIN_CHECKS_FOR_CORRELATION ? (
          <p className="mt-1">
            Not enough visits yet: a pattern needs at least {MIN_CHECKS_FOR_CORRELATION} rated
            checks, and this zone has {c.n}.
          </p>
        ) : (
          <ul className="mt-1 list-disc space-y-1 pl-5">
            <li>
              {c.nitrogen
                ? correlationSentence(
                    `the nitrogen available in the ${NITROGEN_WINDOW_DAYS} days before each check`,
                    c.nitrogen,
                  )
                : "Nitrogen: the feeding did not vary between checks, so there is nothing to compare."}
            </li>
            <li>
              {c.water
                ? correlationSentence("the 14-day water balance before each check", c.water)
                : "Water: not enough weather to compare."}
            </li>
            {c.respondsToNitrogen !== null ? (
              <li>
                {c.respondsToNitrogen
                  ? "This zone counts as responding to nitrogen"
                  : "This zone does not count as responding to nitrogen"}{" "}
                (Pearson r significant at 5 % and both r at least {RESPONDS_TO_N_R}).
              </li>
            ) : null}
          </ul>
        )}
        <p className="mt-3 rounded-lg bg-sun-tint p-3 text-sm">
          <strong>Correlation is not cause.</strong> A zone can improve after a feeding because of
          the season, the weather, overseeding or mowing at the same time. Read a pattern as a
          reason to look closer, not as proof. Water-soluble N counts on the day it is applied,
          slow-release N over 8 weeks; an application at the same visit comes after the check and is
          not counted.
        </p>
      </div>
    </section>
  );
}
