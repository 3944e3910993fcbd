"use client";

// The homeowner's chart: the lawn's Sward Index over time, nothing else — large, calm, readable.
import { useParentSize } from "@visx/responsive";
import { AreaSeries, Axis, GlyphSeries, Grid, XYChart } from "@visx/xychart";
import { useMemo } from "react";

import { palette } from "@/tailwind.config";

import { chartTheme, dayToDate, shortDate } from "./chart-kit";

interface Point {
  date: string;
  index: number;
}

const x = (p: Point) => dayToDate(p.date);

export function SimpleTrendChart({
  label,
  from,
  to,
  points,
}: {
  label: string;
  from: string;
  to: string;
  points: Point[];
}) {
  const { parentRef, width } = useParentSize({ debounceTime: 50, ignoreDimensions: "height" });
  const xScale = useMemo(
    () => ({ type: "time" as const, domain: [dayToDate(from), dayToDate(to)] }),
    [from, to],
  );
  return (
    <div ref={parentRef} className="w-full" style={{ minHeight: 200 }}>
      {width > 0 ? (
        <XYChart
          theme={chartTheme}
          width={width}
          height={200}
          margin={{ top: 10, right: 16, bottom: 28, left: 36 }}
          xScale={xScale}
          yScale={{ type: "linear", domain: [0, 100] }}
          accessibilityLabel={label}
        >
          <Grid columns={false} numTicks={3} />
          <AreaSeries
            dataKey="Sward Index"
            data={points}
            xAccessor={x}
            yAccessor={(p) => p.index}
            fill={palette.sward.tint}
            lineProps={{ stroke: palette.sward.DEFAULT, strokeWidth: 3 }}
          />
          <GlyphSeries
            dataKey="Visits"
            data={points}
            xAccessor={x}
            yAccessor={(p) => p.index}
            size={9}
            colorAccessor={() => palette.sward.deep}
          />
          <Axis orientation="left" numTicks={3} />
          <Axis orientation="bottom" numTicks={width < 480 ? 3 : 5} tickFormat={shortDate} />
        </XYChart>
      ) : null}
    </div>
  );
}
