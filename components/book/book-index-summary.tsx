// Across the book (managers): how the property indexes are spread, which properties are
// declining, and the share of zones whose Index moves with the nitrogen they get.
import Link from "next/link";

import { ChartFigure, Td, Th } from "@/components/charts/chart-figure";
import { DistributionChart } from "@/components/charts/distribution-chart";
import { BOOK_PATH } from "@/lib/paths";
import type { BookScoring } from "@/lib/scoring/dto";
import { MIN_CHECKS_FOR_CORRELATION, RESPONDS_TO_N_R } from "@/lib/scoring/history";

/** Named one by one up to this many; beyond it, the first few and a link to the filtered book. */
const NAMED_DECLINING = 8;

export function BookIndexSummary({ book }: { book: BookScoring }) {
  const declining = book.declining;
  const share = book.zonesWithEnoughChecks
    ? Math.round((100 * book.zonesRespondingToN) / book.zonesWithEnoughChecks)
    : null;
  const median = book.median;
  return (
    <section aria-labelledby="book-title" className="mb-8 space-y-3">
      <h2 id="book-title" className="text-2xl font-bold">
        Across the book
      </h2>
      <div className="grid gap-3 md:grid-cols-2">
        <ChartFigure
          id="book-distribution"
          title="Property indexes"
          tableCaption="Properties by latest index, in bins of 10"
          summary={
            <p>
              {book.scored} of {book.total} properties have an Index
              {median !== null ? `, with a median of ${Math.round(median)}` : ""}.{" "}
              {declining.length === 0 ? (
                "None is declining."
              ) : declining.length <= NAMED_DECLINING ? (
                `Declining: ${declining.map((p) => p.name).join(", ")}.`
              ) : (
                <>
                  {declining.length} are declining, steepest first:{" "}
                  {declining
                    .slice(0, 5)
                    .map((p) => p.name)
                    .join(", ")}
                  …{" "}
                  <Link href={`${BOOK_PATH}?trend=declining`} className="font-semibold text-sward">
                    See all {declining.length} in the book
                  </Link>
                  .
                </>
              )}
            </p>
          }
          chart={
            <DistributionChart
              label="Number of properties by latest property index, in bins of 10"
              bins={book.distribution}
            />
          }
          table={
            <>
              <thead>
                <tr>
                  <Th>Latest index</Th>
                  <Th>Properties</Th>
                </tr>
              </thead>
              <tbody>
                {book.distribution.map((b) => (
                  <tr key={b.from}>
                    <Td>
                      {b.from}–{b.to}
                    </Td>
                    <Td className="font-bold">{b.count}</Td>
                  </tr>
                ))}
              </tbody>
            </>
          }
        />
        <div className="rounded-xl border border-line bg-card p-4">
          <h3 className="text-lg font-bold">Zones that respond to nitrogen</h3>
          {share === null ? (
            <p className="mt-1">
              Not enough visits yet: no zone has {MIN_CHECKS_FOR_CORRELATION} rated checks this
              year.
            </p>
          ) : (
            <>
              <p className="mt-2 text-4xl font-bold text-sward">{share} %</p>
              <p className="mt-1">
                {book.zonesRespondingToN} of {book.zonesWithEnoughChecks} zones with at least{" "}
                {MIN_CHECKS_FOR_CORRELATION} checks have an Index that rises with the nitrogen
                available before each check (Pearson and Spearman r both at least {RESPONDS_TO_N_R}
                ).
                {book.zonesTotal > book.zonesWithEnoughChecks
                  ? ` ${book.zonesTotal - book.zonesWithEnoughChecks} more ${book.zonesTotal - book.zonesWithEnoughChecks === 1 ? "zone has" : "zones have"} fewer checks.`
                  : ""}
              </p>
            </>
          )}
          <p className="mt-3 rounded-lg bg-sun-tint p-3 text-sm">
            <strong>Correlation is not cause.</strong> Zones that do not follow the feeding are
            worth a look: shade, disease, insects or water may be what holds them back.
          </p>
        </div>
      </div>
    </section>
  );
}
