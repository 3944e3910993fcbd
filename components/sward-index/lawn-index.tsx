// The homeowner's view of the Index: one number, the direction in plain words, a simple chart.
import { ChartFigure, Td, Th } from "@/components/charts/chart-figure";
import { SimpleTrendChart } from "@/components/charts/simple-trend-chart";
import { formatDate } from "@/lib/dates";
import type { PropertyScoreHistory } from "@/lib/scoring/dto";
import { lawnHeadline } from "@/lib/scoring/words";

export function LawnIndex({ history, locale }: { history: PropertyScoreHistory; locale?: string }) {
  const latest = history.visits.at(-1);
  if (!latest)
    return (
      <p className="mb-6 rounded-lg border border-line bg-card p-4">
        Your lawn&apos;s Sward Index appears after the first visit.
      </p>
    );
  // One sentence builder for the trend and the change, so they never contradict each other.
  const headline = lawnHeadline(
    {
      word: history.trend?.word ?? null,
      n: history.trend?.n ?? 0,
      change: history.season?.change ?? null,
      since: history.season?.from.date ?? null,
    },
    locale,
  );
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
                out of 100, at the visit of {formatDate(latest.date, locale)}.
              </span>
            </p>
            <p data-tone={headline.tone}>{headline.sentences.join(" ")}</p>
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
                  <Td>{formatDate(v.date, locale)}</Td>
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
