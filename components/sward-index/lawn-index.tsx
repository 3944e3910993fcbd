// The homeowner's view of the Index: one number, the direction in plain words, a simple chart.
import { ChartFigure, Td, Th } from "@/components/charts/chart-figure";
import { SimpleTrendChart } from "@/components/charts/simple-trend-chart";
import { formatDate } from "@/lib/dates";
import type { PropertyScoreHistory } from "@/lib/scoring/dto";
import { MIN_CHECKS_FOR_TREND_WORD } from "@/lib/scoring/weights";

const SAYING = {
  improving: "Your lawn is getting healthier.",
  steady: "Your lawn is holding steady.",
  declining: "Your lawn has slipped lately. Your technician records what they find at each visit.",
} as const;

export function LawnIndex({ history }: { history: PropertyScoreHistory }) {
  const latest = history.visits.at(-1);
  if (!latest)
    return (
      <p className="mb-6 rounded-lg border border-line bg-card p-4">
        Your lawn&apos;s Sward Index appears after the first visit.
      </p>
    );
  const word = history.trend?.word ?? null;
  const n = history.trend?.n ?? 0;
  const change = history.season?.change ?? null;
  return (
    <div className="mb-6">
      <ChartFigure
        id={`lawn-index-${history.propertyId}`}
        title="Sward Index"
        tableCaption="Sward Index of your lawn per visit"
        summary={
          <>
            <p>
              <span className="text-3xl font-bold text-sward">{Math.round(latest.index)}</span>{" "}
              <span className="text-muted">
                out of 100, at the visit of {formatDate(latest.date)}.
              </span>
            </p>
            <p>
              {word
                ? `${SAYING[word]} Based on ${n} visits in the last 120 days.`
                : n < MIN_CHECKS_FOR_TREND_WORD
                  ? `A direction shows after ${MIN_CHECKS_FOR_TREND_WORD} visits within 120 days (${n} so far).`
                  : `No clear direction over the last ${n} visits: the scores vary more than they move.`}
              {change !== null && history.season
                ? ` ${change >= 0 ? "Up" : "Down"} ${Math.abs(Math.round(change))} points since ${formatDate(history.season.from.date)}.`
                : ""}
            </p>
            <p className="text-sm text-muted">
              The Sward Index is your lawn&apos;s health from 0 to 100. It sums up what your
              technician rated: color, thickness, evenness, bare patches, weeds and any disease or
              insect damage.
            </p>
          </>
        }
        chart={
          <SimpleTrendChart
            label="Sward Index of your lawn at each visit"
            from={history.from}
            to={history.today}
            points={history.visits}
          />
        }
        table={
          <>
            <thead>
              <tr>
                <Th>Visit</Th>
                <Th>Sward Index</Th>
              </tr>
            </thead>
            <tbody>
              {history.visits.map((v) => (
                <tr key={v.visitId}>
                  <Td>{formatDate(v.date)}</Td>
                  <Td className="font-bold">{Math.round(v.index)}</Td>
                </tr>
              ))}
            </tbody>
          </>
        }
      />
    </div>
  );
}
