// Reference evapotranspiration, FAO-56: Allen, Pereira, Raes & Smith (1998), "Crop
// evapotranspiration — Guidelines for computing crop water requirements", FAO Irrigation and
// Drainage Paper 56. Equation numbers refer to that paper. Pure functions, SI units, mm/day.

const SOLAR_CONSTANT = 0.082; // Gsc, MJ m⁻² min⁻¹
const STEFAN_BOLTZMANN = 4.903e-9; // σ, MJ K⁻⁴ m⁻² day⁻¹
const ALBEDO = 0.23; // grass reference crop

const rad = (deg: number) => (deg * Math.PI) / 180;

export function dayOfYear(date: string): number {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return Math.round((Date.UTC(y, m - 1, d) - Date.UTC(y, 0, 1)) / 86_400_000) + 1;
}

/** Atmospheric pressure, kPa, from elevation z in m (eq. 7). */
export const atmosphericPressure = (elevationM: number) =>
  101.3 * ((293 - 0.0065 * elevationM) / 293) ** 5.26;

/** Psychrometric constant γ, kPa °C⁻¹ (eq. 8). */
export const psychrometricConstant = (pressureKPa: number) => 0.665e-3 * pressureKPa;

/** Saturation vapour pressure e°(T), kPa (eq. 11). */
export const saturationVapourPressure = (tC: number) =>
  0.6108 * Math.exp((17.27 * tC) / (tC + 237.3));

/** Slope of the saturation vapour pressure curve Δ at T, kPa °C⁻¹ (eq. 13). */
const vapourPressureSlope = (tC: number) =>
  (4098 * saturationVapourPressure(tC)) / (tC + 237.3) ** 2;

/** Wind speed at 2 m from a measurement at height z (eq. 47). */
export const windAt2m = (speedMs: number, heightM: number) =>
  heightM === 2 ? speedMs : (speedMs * 4.87) / Math.log(67.8 * heightM - 5.42);

/** Actual vapour pressure ea, kPa: from RHmax and RHmin (eq. 17), RHmean (eq. 19), or Tmin as dew point (eq. 48). */
export function actualVapourPressure(
  tmaxC: number,
  tminC: number,
  rh: { rhMaxPct?: number; rhMinPct?: number; rhMeanPct?: number },
): number {
  const eTmax = saturationVapourPressure(tmaxC);
  const eTmin = saturationVapourPressure(tminC);
  if (rh.rhMaxPct !== undefined && rh.rhMinPct !== undefined)
    return (eTmin * rh.rhMaxPct + eTmax * rh.rhMinPct) / 200;
  if (rh.rhMeanPct !== undefined) return (rh.rhMeanPct / 100) * ((eTmax + eTmin) / 2);
  return eTmin;
}

function solarGeometry(latitudeDeg: number, doy: number) {
  const phi = rad(latitudeDeg);
  const dr = 1 + 0.033 * Math.cos(((2 * Math.PI) / 365) * doy); // eq. 23
  const delta = 0.409 * Math.sin(((2 * Math.PI) / 365) * doy - 1.39); // eq. 24
  const ws = Math.acos(Math.min(1, Math.max(-1, -Math.tan(phi) * Math.tan(delta)))); // eq. 25, polar day/night clamped
  return { phi, dr, delta, ws };
}

/** Extraterrestrial radiation Ra, MJ m⁻² day⁻¹ (eq. 21). */
export function extraterrestrialRadiation(latitudeDeg: number, dayOfYearValue: number): number {
  const { phi, dr, delta, ws } = solarGeometry(latitudeDeg, dayOfYearValue);
  return (
    ((24 * 60) / Math.PI) *
    SOLAR_CONSTANT *
    dr *
    (ws * Math.sin(phi) * Math.sin(delta) + Math.cos(phi) * Math.cos(delta) * Math.sin(ws))
  );
}

/** Daylight hours N (eq. 34). */
const daylightHours = (latitudeDeg: number, doy: number) =>
  (24 / Math.PI) * solarGeometry(latitudeDeg, doy).ws;

export interface PenmanMonteithDay {
  date: string;
  latitudeDeg: number;
  elevationM: number;
  tmaxC: number;
  tminC: number;
  rhMaxPct?: number;
  rhMinPct?: number;
  rhMeanPct?: number;
  windSpeedMs: number;
  windHeightM: number;
  sunshineHours?: number;
  solarRadiationMJ?: number;
}

/** Every intermediate of the daily FAO Penman–Monteith calculation (eq. 6), for checks and display. */
export function penmanMonteithSteps(day: PenmanMonteithDay) {
  const doy = dayOfYear(day.date);
  const tmean = (day.tmaxC + day.tminC) / 2;
  const P = atmosphericPressure(day.elevationM);
  const gamma = psychrometricConstant(P);
  const delta = vapourPressureSlope(tmean);
  const es = (saturationVapourPressure(day.tmaxC) + saturationVapourPressure(day.tminC)) / 2; // eq. 12
  const ea = actualVapourPressure(day.tmaxC, day.tminC, day);
  const u2 = windAt2m(day.windSpeedMs, day.windHeightM);
  const Ra = extraterrestrialRadiation(day.latitudeDeg, doy);
  const N = daylightHours(day.latitudeDeg, doy);
  // Solar radiation: measured, else from sunshine (Ångström, eq. 35 with a = 0.25, b = 0.50),
  // else from the temperature range (Hargreaves radiation, eq. 50, kRs = 0.16 for interior sites).
  const Rs =
    day.solarRadiationMJ ??
    (day.sunshineHours !== undefined
      ? (0.25 + (0.5 * Math.min(day.sunshineHours, N)) / N) * Ra
      : 0.16 * Math.sqrt(Math.max(0, day.tmaxC - day.tminC)) * Ra);
  const Rso = (0.75 + 2e-5 * day.elevationM) * Ra; // eq. 37
  const Rns = (1 - ALBEDO) * Rs; // eq. 38
  const tmaxK = day.tmaxC + 273.16;
  const tminK = day.tminC + 273.16;
  const relativeShortwave = Rso > 0 ? Math.min(1, Rs / Rso) : 0;
  const Rnl =
    STEFAN_BOLTZMANN *
    ((tmaxK ** 4 + tminK ** 4) / 2) *
    (0.34 - 0.14 * Math.sqrt(ea)) *
    (1.35 * relativeShortwave - 0.35); // eq. 39
  const Rn = Rns - Rnl; // eq. 40
  const G = 0; // daily step (eq. 42)
  const et0 =
    (0.408 * delta * (Rn - G) + gamma * (900 / (tmean + 273)) * u2 * (es - ea)) /
    (delta + gamma * (1 + 0.34 * u2));
  return {
    doy,
    tmean,
    P,
    gamma,
    delta,
    es,
    ea,
    u2,
    Ra,
    N,
    Rs,
    Rso,
    Rns,
    Rnl,
    Rn,
    G,
    et0: Math.max(0, et0),
  };
}

/** Daily reference ET, FAO Penman–Monteith (eq. 6), mm/day. */
export function penmanMonteithEt0(day: PenmanMonteithDay): number {
  return penmanMonteithSteps(day).et0;
}

/** Daily reference ET from temperatures only, Hargreaves (eq. 52), mm/day. */
export function hargreavesEt0(day: {
  date: string;
  latitudeDeg: number;
  tmaxC: number;
  tminC: number;
}): number {
  const Ra = extraterrestrialRadiation(day.latitudeDeg, dayOfYear(day.date));
  const tmean = (day.tmaxC + day.tminC) / 2;
  return Math.max(
    0,
    0.0023 * (tmean + 17.8) * Math.sqrt(Math.max(0, day.tmaxC - day.tminC)) * 0.408 * Ra,
  );
}
