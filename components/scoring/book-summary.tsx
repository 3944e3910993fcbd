// Across the book (managers): how the property indexes are spread, which properties are
// declining, and the share of zones whose Index moves with the nitrogen they get.
import Link from "next/link";
import { DistributionChart } from "@/components/charts/distribution-chart";
import { MIN_CHECKS_FOR_CORRELATION, RESPONDS_TO_N_R } from "@/lib/scoring/history";
import type { BookScoring } from "@/lib/scoring/queries";
import { ChartFigure, Td, Th } from "./chart-figure";
import { TrendBadge } from "./trend-badge";

export function BookSummary({ book }: { book: BookScoring }) {
  const scored = book.properties.filter((p) => p.latest);
  const declining = book.properties.filter((p) => p.trend?.word === "declining");
  const share = book.zonesWithEnoughChecks ? Math.round((100 * book.zonesRespondingToN) / book.zonesWithEnoughChecks) : null;
  const median = scored.length ? [...scored].sort((a, b) => a.latest!.index - b.latest!.index)[Math.floor((scored.length - 1) / 2)]!.latest!.index : null;
  return (
    <section aria-labelledby="book-title" className="mb-8 space-y-3">
      <h2 id="book-title" className="text-2xl font-bold">
        Across the book
      </h2>
      <div className="grid gap-3 md:grid-cols-2">
        <ChartFigure
          id="book-distribution"
          title="Property indexes"
          tableCaption="Properties by latest index"
          summary={
            <p>
              {scored.length} of {book.properties.length} properties have an Index{median !== null ? `, with a median of ${Math.round(median)}` : ""}.{" "}
              {declining.length === 0 ? "None is declining." : `Declining: ${declining.map((p) => p.name).join(", ")}.`}
            </p>
          }
          chart={<DistributionChart label="Number of properties by latest property index, in bins of 10" bins={book.distribution} />}
          table={
            <>
              <thead>
                <tr>
                  <Th>Property</Th>
                  <Th>Latest index</Th>
                  <Th>Trend</Th>
                </tr>
              </thead>
              <tbody>
                {book.properties.map((p) => (
                  <tr key={p.propertyId}>
                    <Td>
                      <Link href={`/properties/${p.propertyId}`} className="font-semibold text-sward">
                        {p.name}
                      </Link>
                    </Td>
                    <Td className="font-bold">{p.latest ? Math.round(p.latest.index) : "—"}</Td>
                    <Td>
                      <TrendBadge word={p.trend?.word ?? null} />
                    </Td>
                  </tr>
                ))}
              </tbody>
            </>
          }
        />
        <div className="rounded-xl border border-line bg-card p-4">
          <h3 className="text-lg font-bold">Zones that respond to nitrogen</h3>
          {share === null ? (
            <p className="mt-1">Not enough visits yet: no zone has {MIN_CHECKS_FOR_CORRELATION} rated checks this year.</p>
          ) : (
            <>
              <p className="mt-2 text-4xl font-bold text-sward">{share} %</p>
              <p className="mt-1">
                {book.zonesRespondingToN} of {book.zonesWithEnoughChecks} zones with at least {MIN_CHECKS_FOR_CORRELATION} checks have an Index that rises with the nitrogen available before each check (Pearson and Spearman r both at least {RESPONDS_TO_N_R}).
                {book.zonesTotal > book.zonesWithEnoughChecks ? ` ${book.zonesTotal - book.zonesWithEnoughChecks} more ${book.zonesTotal - book.zonesWithEnoughChecks === 1 ? "zone has" : "zones have"} fewer checks.` : ""}
              </p>
            </>
          )}
          <p className="mt-3 rounded-lg bg-sun-tint p-3 text-sm">
            <strong>Correlation is not cause.</strong> Zones that do not follow the feeding are worth a look: shade, disease, insects or water may be what holds them back.
          </p>
        </div>
      </div>
    </section>
  );
}
