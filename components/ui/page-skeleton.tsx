// What a page shows while its data loads (route-level loading.tsx): a title bar and a few cards in
// the page's own layout, pulsing, with a spoken "Loading…" for screen readers. No figures: a
// skeleton never shows numbers that could be read as data.
export function PageSkeleton({
  label = "Loading…",
  cards = 3,
}: {
  label?: string;
  cards?: number;
}) {
  return (
    <div role="status" aria-live="polite" className="space-y-4" data-skeleton>
      <span className="sr-only">{label}</span>
      <div aria-hidden="true" className="space-y-4 motion-safe:animate-pulse">
        <div className="h-9 w-2/3 max-w-md rounded-lg bg-line" />
        <div className="h-5 w-1/2 max-w-sm rounded bg-line" />
        {Array.from({ length: cards }, (_, i) => (
          <div key={i} className="space-y-3 rounded-xl border border-line bg-card p-4">
            <div className="h-6 w-1/3 rounded bg-line" />
            <div className="h-4 w-5/6 rounded bg-line" />
            <div className="h-4 w-2/3 rounded bg-line" />
          </div>
        ))}
      </div>
    </div>
  );
}
