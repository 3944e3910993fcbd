"use client";

// How the book's property indexes are spread, in bins of 10 points.
import { useParentSize } from "@visx/responsive";
import { Axis, BarSeries, Grid, XYChart } from "@visx/xychart";

import { palette } from "@/tailwind.config";

import { chartTheme } from "./chart-kit";

interface Bin {
  from: number;
  to: number;
  count: number;
}

const binLabel = (b: Bin) => `${b.from}–${b.to}`;

export function DistributionChart({ label, bins }: { label: string; bins: Bin[] }) {
  const { parentRef, width } = useParentSize({ debounceTime: 50, ignoreDimensions: "height" });
  const maxCount = Math.max(1, ...bins.map((b) => b.count));
  return (
    <div ref={parentRef} className="w-full" style={{ minHeight: 200 }}>
      {width > 0 ? (
        <XYChart
          theme={chartTheme}
          width={width}
          height={200}
          margin={{ top: 10, right: 12, bottom: 40, left: 40 }}
          xScale={{ type: "band", paddingInner: 0.2, paddingOuter: 0.1 }}
          yScale={{ type: "linear", domain: [0, maxCount], nice: true }}
          accessibilityLabel={label}
        >
          <Grid columns={false} numTicks={Math.min(4, maxCount)} />
          <BarSeries
            dataKey="Properties"
            data={bins}
            xAccessor={binLabel}
            yAccessor={(b) => b.count}
            colorAccessor={(b) =>
              b.from < 60
                ? palette.clay.DEFAULT
                : b.from < 70
                  ? palette.sun.DEFAULT
                  : palette.sward.DEFAULT
            }
          />
          <Axis
            orientation="left"
            numTicks={Math.min(4, maxCount)}
            tickFormat={(v) => (Number.isInteger(v) ? String(v) : "")}
            label="Properties"
            labelOffset={12}
          />
          <Axis
            orientation="bottom"
            tickFormat={(label: string) => label.split("–")[0]!}
            label="Property index (bins of 10 points)"
            labelOffset={8}
          />
        </XYChart>
      ) : null}
    </div>
  );
}
