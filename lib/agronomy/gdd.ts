// Growing degree days, plain averaging method: max(0, (Tmax + Tmin)/2 − base), in the unit given
// (°F·day with a 50 °F base, or °C·day with 10 °C; 1 °F·day = 5/9 °C·day).
export function growingDegreeDays(tmax: number, tmin: number, base: number): number {
  return Math.max(0, (tmax + tmin) / 2 - base);
}
