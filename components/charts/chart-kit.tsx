"use client";

// Shared pieces of Sward's charts (@visx/xychart): the theme from our palette, dates on a time
// axis, and the vertical markers (feedings, before/after photos) drawn over a chart's plot area.
import { buildChartTheme, DataContext } from "@visx/xychart";
import { useContext } from "react";

import { palette } from "@/tailwind.config";

export const chartTheme = buildChartTheme({
  backgroundColor: palette.card,
  colors: [palette.sward.DEFAULT, palette.rain.DEFAULT, palette.sun.DEFAULT, palette.clay.DEFAULT],
  gridColor: palette.line,
  gridColorDark: palette.muted,
  tickLength: 4,
  svgLabelSmall: { fill: palette.muted, fontSize: 12, fontFamily: "inherit" },
  svgLabelBig: { fill: palette.ink, fontSize: 13, fontFamily: "inherit" },
  xAxisLineStyles: { stroke: palette.line },
  yAxisLineStyles: { stroke: palette.line },
  xTickLineStyles: { stroke: palette.line },
  yTickLineStyles: { stroke: palette.line },
});

/** Noon UTC of an ISO date, so a day never slides across a time-zone boundary. */
export const dayToDate = (iso: string) => new Date(`${iso}T12:00:00Z`);

const SHORT = new Intl.DateTimeFormat("en-US", { day: "numeric", month: "short", timeZone: "UTC" });
export const shortDate = (d: Date | { valueOf(): number }) => SHORT.format(new Date(d.valueOf()));

/** Every day from `from` to `to` (inclusive), for daily bars that need one datum per day. */
export function everyDay(from: string, to: string): string[] {
  const days: string[] = [];
  for (let t = Date.parse(`${from}T00:00:00Z`); t <= Date.parse(`${to}T00:00:00Z`); t += 86_400_000)
    days.push(new Date(t).toISOString().slice(0, 10));
  return days;
}

/** Fewer ticks on a phone. */
export const tickCount = (width: number) => (width < 480 ? 3 : width < 800 ? 5 : 7);

export interface Marker {
  date: string;
  label: string;
  tone: "feed" | "photo";
}

/** Vertical lines with short labels over the plot area (inside an XYChart); on a phone "lb N" is dropped from the labels. */
export function Markers({ markers }: { markers: Marker[] }) {
  const { xScale, margin, innerHeight, width } = useContext(DataContext);
  if (!xScale || !margin || !innerHeight) return null;
  const scale = xScale as unknown as (d: Date) => number;
  return (
    <g aria-hidden="true">
      {markers.map((m, i) => {
        const x = scale(dayToDate(m.date));
        if (!Number.isFinite(x)) return null;
        const color = m.tone === "feed" ? palette.sun.DEFAULT : palette.ink;
        // Labels alternate between two rows so neighbouring feedings stay readable on a phone.
        const row = m.tone === "photo" ? innerHeight - 6 : 12 + (i % 2) * 14;
        return (
          <g key={`${m.tone}-${m.date}-${i}`}>
            <line
              x1={x}
              x2={x}
              y1={margin.top}
              y2={margin.top + innerHeight}
              stroke={color}
              strokeWidth={1.5}
              strokeDasharray={m.tone === "feed" ? "4 3" : "1 3"}
            />
            <text x={x + 3} y={margin.top + row} fontSize={11} fill={color} fontWeight={600}>
              {width && width < 560 ? m.label.replace(" lb N", "") : m.label}
            </text>
          </g>
        );
      })}
    </g>
  );
}
