"use client";

// The weather strip under an Index chart, on the same dates: daily rain (bars) with reference
// ET (line), and growing degree days (base 50 °F). Same left margin as the Index chart, so a
// date lines up across the charts.
import { useParentSize } from "@visx/responsive";
import { Axis, BarSeries, Grid, LineSeries, XYChart } from "@visx/xychart";
import { useMemo } from "react";

import { palette } from "@/tailwind.config";

import { chartTheme, dayToDate, shortDate, tickCount } from "./chart-kit";

export interface StripDay {
  date: string;
  rainIn: number;
  et0In: number;
  gddF: number;
}

const MARGIN = { top: 8, right: 16, bottom: 8, left: 44 };
const x = (d: StripDay) => dayToDate(d.date);

export function WeatherStrip({
  label,
  from,
  to,
  days,
}: {
  label: string;
  from: string;
  to: string;
  days: StripDay[];
}) {
  const { parentRef, width } = useParentSize({ debounceTime: 50, ignoreDimensions: "height" });
  const xScale = useMemo(
    () => ({ type: "time" as const, domain: [dayToDate(from), dayToDate(to)] }),
    [from, to],
  );
  const maxRain = Math.max(0.5, ...days.map((d) => Math.max(d.rainIn, d.et0In)));
  const maxGdd = Math.max(10, ...days.map((d) => d.gddF));
  return (
    <div ref={parentRef} className="w-full" style={{ minHeight: 192 }}>
      {width > 0 ? (
        <div>
          <XYChart
            theme={chartTheme}
            width={width}
            height={96}
            margin={MARGIN}
            xScale={xScale}
            yScale={{ type: "linear", domain: [0, maxRain], nice: true }}
            accessibilityLabel={`${label}: rain and reference ET, inches per day`}
          >
            <Grid columns={false} numTicks={2} />
            <BarSeries
              dataKey="Rain (in)"
              data={days}
              xAccessor={x}
              yAccessor={(d) => d.rainIn}
              colorAccessor={() => palette.rain.DEFAULT}
              barPadding={0.15}
            />
            <LineSeries
              dataKey="Reference ET (in)"
              data={days}
              xAccessor={x}
              yAccessor={(d) => d.et0In}
              stroke={palette.sun.DEFAULT}
              strokeWidth={1.5}
            />
            <Axis orientation="left" numTicks={2} label="in/day" labelOffset={14} />
          </XYChart>
          <XYChart
            theme={chartTheme}
            width={width}
            height={96}
            margin={{ ...MARGIN, bottom: 26 }}
            xScale={xScale}
            yScale={{ type: "linear", domain: [0, maxGdd], nice: true }}
            accessibilityLabel={`${label}: growing degree days, base 50 °F`}
          >
            <Grid columns={false} numTicks={2} />
            <BarSeries
              dataKey="GDD (°F)"
              data={days}
              xAccessor={x}
              yAccessor={(d) => d.gddF}
              colorAccessor={() => palette.sward.DEFAULT}
              barPadding={0.15}
            />
            <Axis orientation="left" numTicks={2} label="GDD" labelOffset={14} />
            <Axis orientation="bottom" numTicks={tickCount(width)} tickFormat={shortDate} />
          </XYChart>
        </div>
      ) : null}
    </div>
  );
}
