// Checks one application against the product's label (pure): the maximum rate per application,
// the maximum over a year and the minimum interval between applications of the product on the
// same turf. The label is the law (FIFRA makes use inconsistent with a pesticide's labeling
// unlawful, 7 U.S.C. 136j(a)(2)(G), cited from memory; fertilizer labels carry the maker's directions): a breach is
// a refusal that no one can override. Rates are compared as lb of product per 1,000 ft², each
// converted by the caller from its unit (liquids through their density); messages speak the
// label's unit. "Per year" is read as the 365 days ending on the application date, which is
// never looser than a calendar-year reading.
import { weatherNotes, type ApplicationFacts, type RuleFinding } from "./rules";

export interface LabelLimits {
  productName: string;
  registrationNumber: string;
  /** The label's unit, as shown ("lb / 1,000 ft²"). */
  unitLabel: string;
  /** lb of product per 1,000 ft² in one label unit. */
  lbPer1000PerUnit: number;
  maxRate: number | null;
  maxYearly: number | null;
  minIntervalDays: number | null;
}

export interface LabelFacts {
  appliedOn: string; // YYYY-MM-DD
  productLbPer1000: number;
  /** Other applications of this product on the same zone. */
  others: { appliedOn: string; productLbPer1000: number }[];
}

const DAY_MS = 86_400_000;
const daysBetween = (a: string, b: string) =>
  Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / DAY_MS);
const fmt = (x: number) => String(Math.round(x * 100) / 100);

export function checkLabel(label: LabelLimits, a: LabelFacts): RuleFinding[] {
  const source = `Product label: ${label.productName}${label.registrationNumber ? ` (registration ${label.registrationNumber})` : ""}`;
  const inUnit = (lb: number) => lb / label.lbPer1000PerUnit;
  const findings: RuleFinding[] = [];
  const base = { severity: "refusal" as const, basis: "label" as const, source };
  const rate = inUnit(a.productLbPer1000);
  if (label.maxRate === null && label.maxYearly === null && label.minIntervalDays === null) {
    return [
      {
        key: "label_missing",
        severity: "warning",
        basis: "label",
        source,
        value: "not in the catalog",
        limit: "label",
        message:
          "The catalog has no label limits for this product: check the rate against the label before applying, and ask a manager to enter them.",
      },
    ];
  }
  if (label.maxRate !== null && rate > label.maxRate * (1 + 1e-9)) {
    findings.push({
      ...base,
      key: "label_max_rate",
      value: rate,
      limit: label.maxRate,
      message: `${fmt(rate)} ${label.unitLabel} is above the label's maximum of ${fmt(label.maxRate)} ${label.unitLabel} per application.`,
    });
  }
  if (label.maxYearly !== null) {
    const year = a.others.filter((o) => {
      const d = daysBetween(o.appliedOn, a.appliedOn);
      return d >= 0 && d < 365;
    });
    const total = inUnit(year.reduce((s, o) => s + o.productLbPer1000, a.productLbPer1000));
    if (total > label.maxYearly * (1 + 1e-9))
      findings.push({
        ...base,
        key: "label_yearly",
        value: total,
        limit: label.maxYearly,
        message: `This brings the product to ${fmt(total)} ${label.unitLabel} on this zone in the 365 days to ${a.appliedOn}, above the label's yearly maximum of ${fmt(label.maxYearly)}.`,
      });
  }
  if (label.minIntervalDays !== null) {
    const near = a.others
      .map((o) => ({ on: o.appliedOn, days: Math.abs(daysBetween(o.appliedOn, a.appliedOn)) }))
      .filter((o) => o.days < label.minIntervalDays!)
      .sort((x, y) => x.days - y.days)[0];
    if (near)
      findings.push({
        ...base,
        key: "label_interval",
        value: near.days,
        limit: label.minIntervalDays,
        message: `This product was applied to this zone on ${near.on}, ${near.days} day${near.days === 1 ? "" : "s"} apart; the label asks for at least ${label.minIntervalDays} days between applications.`,
      });
  }
  return findings;
}

/**
 * The label's own words about frozen or saturated ground and rain, as a warning with what the
 * visit's weather says (Sward cannot see the ground): the sentences of the label cautions that
 * name them, or nothing when the label does not.
 */
export function labelConditions(
  productName: string,
  labelCautions: string,
  weather: ApplicationFacts["weather"],
): RuleFinding[] {
  const sentences = labelCautions
    .split(/(?<=[.!?])\s+/)
    .filter((x) => /\b(frozen|saturated|rain|rainfall)\b/i.test(x));
  if (!sentences.length) return [];
  const notes = weatherNotes(weather);
  return [
    {
      key: "label_conditions",
      severity: "warning",
      basis: "label",
      source: `Product label: ${productName}`,
      value: notes.join(" ") || "none seen",
      limit: sentences.join(" "),
      message: `The label says: “${sentences.join(" ")}”${notes.length ? ` ${notes.join(" ")}` : ""}`,
    },
  ];
}
