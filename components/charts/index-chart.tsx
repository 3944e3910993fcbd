"use client";

// The Sward Index over time (0–100): a line through the checks, ringed points where photos were
// taken, dashed markers for nitrogen applications (lb N / 1,000 ft²) and, below on the same
// dates, the watering of the zone. Drawn after hydration; the figure around it carries the
// title, the summary in words and the table alternative (components/charts/chart-figure.tsx).
import { useParentSize } from "@visx/responsive";
import { Axis, BarSeries, GlyphSeries, Grid, LineSeries, Tooltip, XYChart } from "@visx/xychart";
import { useMemo } from "react";

import { palette } from "@/tailwind.config";

import {
  chartTheme,
  dayToDate,
  everyDay,
  Markers,
  shortDate,
  tickCount,
  type Marker,
} from "./chart-kit";

export interface IndexChartPoint {
  date: string;
  index: number;
  hasPhoto: boolean;
}

interface Props {
  label: string;
  from: string;
  to: string;
  points: IndexChartPoint[];
  feedings: { date: string; nLb: number }[];
  /** Daily watering depth (in); the water row is drawn only when given. */
  waterings?: { date: string; wateringIn: number }[];
  /** The first and last checks with photos, marked "before" and "after". */
  beforeAfter?: { before: string; after: string } | null;
  height?: number;
}

const MARGIN = { top: 8, right: 16, bottom: 28, left: 44 };
const WATER_HEIGHT = 72;
const x = (p: { date: string }) => dayToDate(p.date);

export function IndexChart({
  label,
  from,
  to,
  points,
  feedings,
  waterings,
  beforeAfter,
  height = 260,
}: Props) {
  const { parentRef, width } = useParentSize({ debounceTime: 50, ignoreDimensions: "height" });
  const xScale = useMemo(
    () => ({ type: "time" as const, domain: [dayToDate(from), dayToDate(to)] }),
    [from, to],
  );
  const yScale = useMemo(
    () => ({ type: "linear" as const, domain: [0, 100] as [number, number], nice: false }),
    [],
  );
  const markers: Marker[] = useMemo(
    () => [
      ...feedings.map((f) => ({
        date: f.date,
        label: `${f.nLb.toFixed(2)} lb N`,
        tone: "feed" as const,
      })),
      ...(beforeAfter && beforeAfter.before !== beforeAfter.after
        ? [
            { date: beforeAfter.before, label: "before", tone: "photo" as const },
            { date: beforeAfter.after, label: "after", tone: "photo" as const },
          ]
        : []),
    ],
    [feedings, beforeAfter],
  );
  const waterDays = useMemo(() => {
    if (!waterings) return null;
    const byDate = new Map(waterings.map((w) => [w.date, w.wateringIn]));
    return everyDay(from, to).map((date) => ({ date, wateringIn: byDate.get(date) ?? 0 }));
  }, [waterings, from, to]);
  const maxWater = waterDays ? Math.max(0.5, ...waterDays.map((w) => w.wateringIn)) : 0;
  const photoPoints = points.filter((p) => p.hasPhoto);

  return (
    <div
      ref={parentRef}
      className="w-full"
      style={{ minHeight: height + (waterDays ? WATER_HEIGHT : 0) }}
    >
      {width > 0 ? (
        <div>
          <XYChart
            theme={chartTheme}
            width={width}
            height={height}
            margin={MARGIN}
            xScale={xScale}
            yScale={yScale}
            accessibilityLabel={label}
          >
            <Grid columns={false} numTicks={5} />
            <Markers markers={markers} />
            <LineSeries
              dataKey="Sward Index"
              data={points}
              xAccessor={x}
              yAccessor={(p) => p.index}
              stroke={palette.sward.DEFAULT}
              strokeWidth={2.5}
            />
            <GlyphSeries
              dataKey="Checks"
              data={points}
              xAccessor={x}
              yAccessor={(p) => p.index}
              size={7}
              colorAccessor={() => palette.sward.deep}
            />
            <GlyphSeries
              dataKey="Photo taken"
              data={photoPoints}
              xAccessor={x}
              yAccessor={(p) => p.index}
              renderGlyph={({ x: cx, y: cy }) => (
                <circle cx={cx} cy={cy} r={7} fill="none" stroke={palette.ink} strokeWidth={1.5} />
              )}
            />
            <Axis orientation="left" numTicks={5} label="Index" labelOffset={14} />
            <Axis orientation="bottom" numTicks={tickCount(width)} tickFormat={shortDate} />
            <Tooltip<IndexChartPoint>
              snapTooltipToDatumX
              snapTooltipToDatumY
              showDatumGlyph
              renderTooltip={({ tooltipData }) => {
                const d = tooltipData?.nearestDatum?.datum;
                if (!d || !("index" in d)) return null;
                return (
                  <span className="text-sm">
                    <strong>{shortDate(dayToDate(d.date))}</strong>: Index {Math.round(d.index)}
                    {d.hasPhoto ? " · photo" : ""}
                  </span>
                );
              }}
            />
          </XYChart>
          {waterDays ? (
            <XYChart
              theme={chartTheme}
              width={width}
              height={WATER_HEIGHT}
              margin={{ ...MARGIN, top: 6, bottom: 8 }}
              xScale={xScale}
              yScale={{ type: "linear", domain: [0, maxWater], nice: true }}
              accessibilityLabel={`${label}: watering, inches per day`}
            >
              <BarSeries
                dataKey="Watering (in)"
                data={waterDays}
                xAccessor={x}
                yAccessor={(w) => w.wateringIn}
                colorAccessor={() => palette.rain.DEFAULT}
                barPadding={0.2}
              />
              <Axis
                orientation="left"
                numTicks={2}
                tickFormat={(v: number) => (v === 0 ? "0" : `${v} in`)}
              />
            </XYChart>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
