// Open-Meteo's answer as Sward's days (lib/services/weather/contract.ts), the query it sends
// (parameter names as Open-Meteo documents them: https://open-meteo.com/en/docs), and the
// service's own daily FAO-56 ETo (`et0_fao_evapotranspiration`) as an outside check of ours
// (lib/agronomy/et0.ts, FAO-56 daily Penman–Monteith, eq. 6) on the local fake's series.
import { describe, expect, it } from "vitest";

import { fakeOpenMeteo, fakeWeatherDay } from "@/fixtures/demo/weather-days";
import { addDays } from "@/lib/dates";
import { pythiumNight } from "@/lib/risk/models";
import {
  daysFromOpenMeteo,
  localToday,
  openMeteoResponseSchema,
  type OpenMeteoResponse,
} from "@/lib/services/weather/contract";
import { openMeteoQuery } from "@/lib/services/weather/provider";
import { deriveDays } from "@/lib/weather/derived";

const hoursOf = (date: string, n = 24) =>
  Array.from({ length: n }, (_, h) => `${date}T${String(Math.min(h, 23)).padStart(2, "0")}:00`);

function answer(o: {
  days: string[];
  hours: string[];
  rh: (number | null)[];
  tmax?: (number | null)[];
}): OpenMeteoResponse {
  const n = o.hours.length;
  const d = o.days.length;
  return openMeteoResponseSchema.parse({
    latitude: 40.34,
    longitude: -74.74,
    elevation: 31,
    generationtime_ms: 0.5,
    utc_offset_seconds: -18000,
    timezone: "America/New_York",
    timezone_abbreviation: "EST",
    hourly_units: { time: "iso8601", temperature_2m: "°C" },
    hourly: {
      time: o.hours,
      temperature_2m: o.hours.map((_, i) => 10 + (i % 24) / 2),
      relative_humidity_2m: o.rh,
      dew_point_2m: Array(n).fill(5),
      precipitation: Array(n).fill(0.1),
      wind_speed_10m: o.hours.map((_, i) => 2 + (i % 2)),
      shortwave_radiation: Array(n).fill(100),
    },
    daily: {
      time: o.days,
      temperature_2m_max: o.tmax ?? Array(d).fill(21.5),
      temperature_2m_min: Array(d).fill(10),
      precipitation_sum: Array(d).fill(2.4),
      shortwave_radiation_sum: Array(d).fill(8.64),
      et0_fao_evapotranspiration: Array(d).fill(1.7),
    },
  });
}

describe("an Open-Meteo answer as Sward's days", () => {
  it("takes daily extremes, rain, radiation and the service's ETo from `daily`; RH and mean wind from the hours", () => {
    const rh = Array.from({ length: 48 }, (_, i) => 50 + (i % 24) * 2);
    const days = daysFromOpenMeteo(
      answer({
        days: ["2026-11-30", "2026-12-01"],
        hours: [...hoursOf("2026-11-30"), ...hoursOf("2026-12-01")],
        rh,
      }),
      "2026-11-30",
      { archive: false },
    );
    expect(days).toHaveLength(2);
    expect(days[0]).toMatchObject({
      date: "2026-11-30",
      tmaxC: 21.5,
      tminC: 10,
      rhMinPct: 50,
      rhMaxPct: 96,
      rhMeanPct: 73,
      windMs: 2.5,
      windHeightM: 10,
      solarMJ: 8.64,
      precipMm: 2.4,
      serviceEt0Mm: 1.7,
      isForecast: false,
    });
    expect(days[0]!.hourly!.time.slice(0, 3)).toEqual(["00:00", "01:00", "02:00"]);
    expect(days[0]!.hourly!.rhPct).toHaveLength(24);
    expect(days[1]!.isForecast).toBe(true); // after the location's today
  });

  it("leaves out a day the archive has not filled yet, and keeps a day with a missing hour without its hours", () => {
    const rh: (number | null)[] = Array(48).fill(80);
    rh[30] = null;
    const days = daysFromOpenMeteo(
      answer({
        days: ["2026-11-20", "2026-11-21"],
        hours: [...hoursOf("2026-11-20"), ...hoursOf("2026-11-21")],
        rh,
        tmax: [12, null],
      }),
      "2026-12-02",
      { archive: true },
    );
    expect(days.map((d) => d.date)).toEqual(["2026-11-20"]);
    const gap = daysFromOpenMeteo(
      answer({
        days: ["2026-11-20", "2026-11-21"],
        hours: [...hoursOf("2026-11-20"), ...hoursOf("2026-11-21")],
        rh,
      }),
      "2026-12-02",
      { archive: true },
    );
    expect(gap[1]).toMatchObject({ date: "2026-11-21", hourly: null, rhMaxPct: 80 });
    expect(gap.every((d) => !d.isForecast)).toBe(true);
  });

  it("keeps the 25 hours of the day clocks fall back", () => {
    const hours = [...hoursOf("2026-11-01", 25), ...hoursOf("2026-11-02")];
    const days = daysFromOpenMeteo(
      answer({ days: ["2026-11-01", "2026-11-02"], hours, rh: Array(49).fill(70) }),
      "2026-12-02",
      { archive: true },
    );
    expect(days[0]!.hourly!.time).toHaveLength(25);
  });

  it("refuses an answer that is not Open-Meteo's shape", () => {
    expect(openMeteoResponseSchema.safeParse({ location: {}, days: [] }).success).toBe(false);
  });

  it("reads the location's today from the answer's UTC offset", () => {
    const at = Date.parse("2026-12-02T03:00:00Z");
    expect(localToday(-18000, at)).toBe("2026-12-01"); // 22:00 in New Jersey
    expect(localToday(0, at)).toBe("2026-12-02");
  });
});

describe("the query Sward sends", () => {
  it("names Open-Meteo's variables, local time and SI wind", () => {
    const q = new URLSearchParams(openMeteoQuery(40.3342, -74.7401, "2026-11-18", "2026-12-09"));
    expect(Object.fromEntries(q)).toEqual({
      latitude: "40.3342",
      longitude: "-74.7401",
      start_date: "2026-11-18",
      end_date: "2026-12-09",
      hourly:
        "temperature_2m,relative_humidity_2m,dew_point_2m,precipitation,wind_speed_10m,shortwave_radiation",
      daily:
        "temperature_2m_max,temperature_2m_min,precipitation_sum,shortwave_radiation_sum,et0_fao_evapotranspiration",
      timezone: "auto",
      wind_speed_unit: "ms",
    });
  });
});

describe("our FAO-56 daily ETo against the service's own (the fake's hourly FAO-56, eq. 53, summed)", () => {
  const places = [
    { name: "central New Jersey", lat: 40.3342, lon: -74.7401 },
    { name: "Twin Cities, Minnesota", lat: 44.9481, lon: -93.2 },
  ];
  for (const p of places) {
    it(`agrees within the daily-vs-hourly difference FAO-56 allows, over a year in ${p.name}`, () => {
      const start = "2025-12-01";
      const days = daysFromOpenMeteo(
        fakeOpenMeteo(p.lat, p.lon, start, addDays(start, 364), {
          archive: true,
          today: "2026-12-02",
        }),
        "2026-12-02",
        { archive: true },
      );
      const ours = deriveDays(days, { latitudeDeg: p.lat, kc: 1, wateringInByDate: {} });
      expect(ours.every((d) => d.et0Method === "penman-monteith")).toBe(true);
      const diff = ours.map((d, i) => d.et0In * 25.4 - days[i]!.serviceEt0Mm!);
      const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
      const theirs = mean(days.map((d) => d.serviceEt0Mm!));
      const summer = diff.slice(182, 274); // June–August
      console.log(
        `ETo, ${p.name}, fake's year: ours − service = ${mean(diff).toFixed(3)} mm/day on average (service mean ${theirs.toFixed(2)} mm/day; June–August ${mean(summer).toFixed(3)}; largest day ${Math.max(...diff.map(Math.abs)).toFixed(2)})`,
      );
      // Sums of hourly ETo and the daily equation differ by several per cent (FAO-56 and the
      // ASCE-EWRI 2005 standardized equation say so; the size is from memory): the mean
      // difference must stay inside 10 % of the service's mean ETo.
      expect(Math.abs(mean(diff))).toBeLessThan(0.1 * theirs);
      expect(Math.abs(mean(summer))).toBeLessThan(
        0.1 * mean(days.slice(182, 274).map((d) => d.serviceEt0Mm!)),
      );
      expect(Math.max(...diff.map(Math.abs))).toBeLessThan(1.5);
    });
  }
});

describe("the demo weather in early December (New Jersey and Minnesota)", () => {
  it("is cold-season weather: highs near 5–10 °C in New Jersey and colder in Minnesota; no Pythium night", () => {
    const from = "2026-11-25";
    const nj = Array.from({ length: 14 }, (_, i) =>
      fakeWeatherDay(40.3342, -74.7401, addDays(from, i), "2026-12-02"),
    );
    const mn = Array.from({ length: 14 }, (_, i) =>
      fakeWeatherDay(44.9481, -93.2, addDays(from, i), "2026-12-02"),
    );
    const meanHigh = (ds: typeof nj) => ds.reduce((s, d) => s + d.tmaxC, 0) / ds.length;
    expect(meanHigh(nj)).toBeGreaterThan(2);
    expect(meanHigh(nj)).toBeLessThan(13);
    expect(meanHigh(mn)).toBeLessThan(meanHigh(nj));
    for (const ds of [nj, mn]) {
      const hours = ds.flatMap((d) =>
        d.hourly!.time.map((t, i) => ({
          at: `${d.date}T${t}`,
          tempC: d.hourly!.tempC[i]!,
          rhPct: d.hourly!.rhPct[i]!,
        })),
      );
      expect(ds.filter((d) => pythiumNight(d, hours)?.risk)).toEqual([]);
      expect(Math.max(...ds.map((d) => d.tmaxC))).toBeLessThan(20);
    }
  });
});
