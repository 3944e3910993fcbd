// Daily values derived from weather and watering (pure): reference ET (FAO-56 Penman–Monteith
// when humidity, wind and sunshine or radiation are known, else Hargreaves), turf water use
// Kc × ETo, 7- and 14-day water balance (rain + watering − use), growing degree days since the
// first day given (base 50 °F), and 5-day moving means of humidity and temperature.
import { hargreavesEt0, penmanMonteithEt0 } from "@/lib/agronomy/et0";
import { growingDegreeDays } from "@/lib/agronomy/gdd";
import { mmToIn, movingMean } from "@/lib/agronomy/water";
import type { WeatherDayInput } from "@/lib/services/weather/contract";

/** Elevation when a property's is unknown; at 50 m vs sea level ETo differs by well under 1 %. */
const DEFAULT_ELEVATION_M = 50;

export interface DerivedDay {
  date: string;
  isForecast: boolean;
  tmaxF: number;
  tminF: number;
  rhMeanPct: number | null;
  rainIn: number;
  wateringIn: number;
  et0In: number;
  et0Method: "penman-monteith" | "hargreaves";
  turfUseIn: number;
  balance7In: number;
  balance14In: number;
  gddF: number;
  gddSinceStartF: number;
  tmean5dF: number;
  rhMean5dPct: number | null;
}

const cToF = (c: number) => (c * 9) / 5 + 32;

export function deriveDays(
  days: WeatherDayInput[],
  options: {
    latitudeDeg: number;
    elevationM?: number;
    kc: number;
    wateringInByDate: Record<string, number>;
  },
): DerivedDay[] {
  const sorted = [...days].sort((a, b) => a.date.localeCompare(b.date));
  const et0 = sorted.map((d) => {
    const complete =
      d.windMs !== null &&
      (d.rhMaxPct !== null && d.rhMinPct !== null ? true : d.rhMeanPct !== null) &&
      (d.sunshineH !== null || d.solarMJ !== null);
    if (complete) {
      return {
        mm: penmanMonteithEt0({
          date: d.date,
          latitudeDeg: options.latitudeDeg,
          elevationM: options.elevationM ?? DEFAULT_ELEVATION_M,
          tmaxC: d.tmaxC,
          tminC: d.tminC,
          rhMaxPct: d.rhMaxPct ?? undefined,
          rhMinPct: d.rhMinPct ?? undefined,
          rhMeanPct: d.rhMeanPct ?? undefined,
          windSpeedMs: d.windMs!,
          windHeightM: d.windHeightM ?? 2,
          sunshineHours: d.sunshineH ?? undefined,
          solarRadiationMJ: d.solarMJ ?? undefined,
        }),
        method: "penman-monteith" as const,
      };
    }
    return {
      mm: hargreavesEt0({
        date: d.date,
        latitudeDeg: options.latitudeDeg,
        tmaxC: d.tmaxC,
        tminC: d.tminC,
      }),
      method: "hargreaves" as const,
    };
  });
  const tmeanF = sorted.map((d) => cToF((d.tmaxC + d.tminC) / 2));
  const rhMean = sorted.map(
    (d) =>
      d.rhMeanPct ??
      (d.rhMaxPct !== null && d.rhMinPct !== null ? (d.rhMaxPct + d.rhMinPct) / 2 : null),
  );
  const t5 = movingMean(tmeanF, 5);
  const net = sorted.map(
    (d, i) =>
      mmToIn(d.precipMm) +
      (options.wateringInByDate[d.date] ?? 0) -
      options.kc * mmToIn(et0[i]!.mm),
  );
  let gddTotal = 0;
  return sorted.map((d, i) => {
    const gdd = growingDegreeDays(cToF(d.tmaxC), cToF(d.tminC), 50);
    gddTotal += gdd;
    const window = (n: number) =>
      net.slice(Math.max(0, i - n + 1), i + 1).reduce((a, b) => a + b, 0);
    const rhWindow = rhMean.slice(Math.max(0, i - 4), i + 1).filter((x): x is number => x !== null);
    return {
      date: d.date,
      isForecast: d.isForecast,
      tmaxF: cToF(d.tmaxC),
      tminF: cToF(d.tminC),
      rhMeanPct: rhMean[i] ?? null,
      rainIn: mmToIn(d.precipMm),
      wateringIn: options.wateringInByDate[d.date] ?? 0,
      et0In: mmToIn(et0[i]!.mm),
      et0Method: et0[i]!.method,
      turfUseIn: options.kc * mmToIn(et0[i]!.mm),
      balance7In: window(7),
      balance14In: window(14),
      gddF: gdd,
      gddSinceStartF: gddTotal,
      tmean5dF: t5[i]!,
      rhMean5dPct: rhWindow.length ? rhWindow.reduce((a, b) => a + b, 0) / rhWindow.length : null,
    };
  });
}
