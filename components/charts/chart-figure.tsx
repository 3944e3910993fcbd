// A chart as a figure: title, what it shows in words, the chart, and the same figures as a
// table (for screen readers, print, and anyone who prefers numbers).
import type { ReactNode } from "react";

export function ChartFigure({
  id,
  title,
  summary,
  chart,
  table,
  tableCaption,
}: {
  id: string;
  title: string;
  summary: ReactNode;
  chart: ReactNode;
  table: ReactNode;
  tableCaption: string;
}) {
  return (
    <figure
      aria-labelledby={`${id}-title`}
      className="rounded-xl border border-line bg-card p-3 sm:p-4"
    >
      <figcaption>
        <h3 id={`${id}-title`} className="text-lg font-bold">
          {title}
        </h3>
        <div className="mt-1 space-y-1 text-ink">{summary}</div>
      </figcaption>
      <div className="mt-3" data-chart={id}>
        {chart}
      </div>
      <details className="mt-2">
        <summary className="min-h-tap cursor-pointer py-2 font-semibold text-sward">
          Show as a table
        </summary>
        <div
          className="overflow-x-auto"
          role="region"
          aria-label={`${tableCaption} (scrolls sideways)`}
          tabIndex={0}
        >
          <table className="w-full text-left text-sm [&_td:first-child]:whitespace-nowrap">
            <caption className="sr-only">{tableCaption}</caption>
            {table}
          </table>
        </div>
      </details>
    </figure>
  );
}

export const Th = ({ children }: { children: ReactNode }) => (
  <th scope="col" className="border-b border-line bg-paper p-2">
    {children}
  </th>
);
export const Td = ({ children, className = "" }: { children: ReactNode; className?: string }) => (
  <td className={`border-b border-line p-2 ${className}`}>{children}</td>
);
