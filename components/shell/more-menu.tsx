"use client";

// The phone bar's last entry when there are more pages than fit: "More" opens a list of the rest
// above the bar. A native <details>, so it opens before the page has hydrated and offline too; it
// closes when the page changes, and is marked current when one of its pages is.
import clsx from "clsx";
import { Ellipsis } from "lucide-react";
import { usePathname } from "next/navigation";
import { useEffect, useRef, type ReactNode } from "react";

export function MoreMenu({ paths, children }: { paths: string[]; children: ReactNode }) {
  const pathname = usePathname();
  const ref = useRef<HTMLDetailsElement>(null);
  useEffect(() => {
    if (ref.current) ref.current.open = false;
  }, [pathname]);
  const isCurrent = paths.some((p) => pathname === p || pathname.startsWith(`${p}/`));
  return (
    <details ref={ref} className="relative flex min-w-0 flex-1 basis-0 flex-col">
      <summary
        className={clsx(
          "flex min-h-tap flex-1 cursor-pointer list-none flex-col items-center justify-center gap-0.5 rounded-lg px-0.5 py-1 text-center text-xs leading-tight font-semibold [&::-webkit-details-marker]:hidden",
          isCurrent ? "bg-sward-tint text-sward-deep" : "text-ink hover:bg-sward-tint",
        )}
      >
        <Ellipsis className="size-6" aria-hidden="true" />
        More
      </summary>
      <div className="absolute right-0 bottom-full mb-3 flex w-56 flex-col gap-1 rounded-xl border border-line bg-card p-2 shadow-lg">
        {children}
      </div>
    </details>
  );
}
