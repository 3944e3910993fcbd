// Student's t distribution (pure): the CDF and the quantile the trend interval and the
// significance of a correlation need. No library in the app's dependencies has them
// (simple-statistics stops at the t statistic), so they are computed here and checked in
// tests/unit/student-t.test.ts against jstat (a general-purpose statistics library, a test-only
// dependency) and against printed t-table values.
//
// Method: for t ≥ 0, P(T ≤ t) = 1 − ½·I_x(ν/2, ½) with x = ν / (ν + t²) (Abramowitz & Stegun
// 1964, 26.7.1 with 26.5.27), I the regularised incomplete beta function evaluated by its continued
// fraction (A&S 26.5.8) with the modified Lentz algorithm, and ln Γ by the Lanczos approximation
// (g = 7, 9 terms; Numerical Recipes 3rd ed. §6.1, §6.4). The quantile inverts the CDF by bisection
// (monotone, so it cannot miss), to 1e-10.

const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313,
  -176.61502916214059, 12.507343278686905, -0.13857109526572012, 9.9843695780195716e-6,
  1.5056327351493116e-7,
] as const;

/** ln Γ(x) for x > 0 (Lanczos, g = 7). */
function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const z = x - 1;
  let a = LANCZOS[0];
  const t = z + 7.5;
  for (let i = 1; i < LANCZOS.length; i++) a += LANCZOS[i]! / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

/** Continued fraction of the incomplete beta function (modified Lentz). */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const TINY = 1e-300;
  let c = 1;
  let d = 1 - ((a + b) * x) / (a + 1);
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 300; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((a + m2 - 1) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (a + b + m) * x) / ((a + m2) * (a + m2 + 1));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const step = d * c;
    h *= step;
    if (Math.abs(step - 1) < 1e-15) break;
  }
  return h;
}

/** Regularised incomplete beta I_x(a, b). */
function incompleteBeta(x: number, a: number, b: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  const front = Math.exp(
    logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(1 - x),
  );
  // The continued fraction converges fast for x < (a + 1) / (a + b + 2); use symmetry otherwise.
  return x < (a + 1) / (a + b + 2)
    ? (front * betaContinuedFraction(a, b, x)) / a
    : 1 - (front * betaContinuedFraction(b, a, 1 - x)) / b;
}

function checkDf(df: number): void {
  if (!(df > 0) || !Number.isFinite(df)) throw new RangeError(`Degrees of freedom must be > 0.`);
}

/** P(T ≤ t) for Student's t with `df` degrees of freedom. */
export function studentTCdf(t: number, df: number): number {
  checkDf(df);
  if (Number.isNaN(t)) return NaN;
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = 0.5 * incompleteBeta(df / (df + t * t), df / 2, 0.5);
  return t >= 0 ? 1 - tail : tail;
}

/** The p-quantile of Student's t with `df` degrees of freedom (0 < p < 1). */
export function studentTQuantile(p: number, df: number): number {
  checkDf(df);
  if (!(p > 0 && p < 1)) throw new RangeError("The probability must be strictly between 0 and 1.");
  if (p === 0.5) return 0;
  if (p < 0.5) return -studentTQuantile(1 - p, df);
  let lo = 0;
  let hi = 1;
  while (studentTCdf(hi, df) < p) hi *= 2; // df = 1, p = 0.9999999 needs about 3e6
  for (let i = 0; i < 200 && hi - lo > 1e-10 * Math.max(1, hi); i++) {
    const mid = (lo + hi) / 2;
    if (studentTCdf(mid, df) < p) lo = mid;
    else hi = mid;
  }
  return (lo + hi) / 2;
}

/** Two-sided p-value of a t statistic: P(|T| ≥ |t|). */
export function twoSidedP(t: number, df: number): number {
  return 2 * (1 - studentTCdf(Math.abs(t), df));
}
