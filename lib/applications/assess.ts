// The one assessment every path that writes an application goes through (the API's
// recordApplication and the demo seed): nutrients from the product and rate, the property's rule
// set on the application's real date, and the product label. Pure; the callers read the facts.
import { checkLabel, labelConditions } from "@/lib/agronomy/label";
import {
  nutrientsPer1000,
  productForArea,
  productLbPer1000,
  type Rate,
} from "@/lib/agronomy/nutrients";
import {
  checkApplication,
  isLabelRefused,
  isRefused,
  type ApplicationFacts,
  type RuleFinding,
  type RuleSetLimits,
} from "@/lib/agronomy/rules";
import { seedingFindings, type ZoneTreatment } from "@/lib/agronomy/seeding";
import { analysisOf, type ProductDto } from "@/lib/products/dto";

import { RATE_UNIT_LABEL } from "./units";

export interface AssessmentInput {
  product: ProductDto;
  rate: Rate;
  areaFt2: number;
  ruleSet: RuleSetLimits | null;
  facts: Omit<
    ApplicationFacts,
    "nPct" | "nLb" | "wsnLb" | "p2o5Lb" | "slowReleasePctOfN" | "byProfessional"
  >;
  /** Other applications of this product on the same zone (for the label's yearly maximum and interval). */
  sameProductOnZone: { appliedOn: string; productLbPer1000: number }[];
  /** The zone's other applications, for the seeding checks (absent: not checked). */
  zoneTreatments?: ZoneTreatment[];
  /** The zone's grass species key (the seed rate check). */
  zoneSpecies?: string;
  /** Dates in words for the seeding warnings (default: as stored). */
  formatDate?: (iso: string) => string;
}

/** A product as the seeding checks see it. */
export function treatmentOf(product: ProductDto, date: string): ZoneTreatment {
  return {
    date,
    productName: product.name,
    preEmergence: product.preEmergenceActive
      ? { active: product.preEmergenceActive, labelIntervalDays: product.seedingIntervalDays }
      : null,
    seedSpecies: product.seedSpecies,
  };
}

export interface Assessment {
  per1000: ReturnType<typeof nutrientsPer1000>;
  totals: ReturnType<typeof productForArea>;
  productLbPer1000: number;
  findings: RuleFinding[];
  /** A limit of law or label is broken. */
  refused: boolean;
  /** A label limit is broken: nobody may override. */
  labelRefused: boolean;
}

/** lb of product per 1,000 ft² in one unit of the product's label rate (null: no label unit). */
export function labelUnitLb(product: ProductDto): number | null {
  if (product.labelRateUnit === null) return null;
  return productLbPer1000(analysisOf(product), { amount: 1, unit: product.labelRateUnit });
}

/** Throws NutrientInputError for a rate the product cannot be measured in. */
export function assessApplication(i: AssessmentInput): Assessment {
  const analysis = analysisOf(i.product);
  const per1000 = nutrientsPer1000(analysis, i.rate);
  const totals = productForArea(analysis, i.rate, i.areaFt2);
  const lb = productLbPer1000(analysis, i.rate);
  const findings: RuleFinding[] = i.ruleSet
    ? checkApplication(i.ruleSet, {
        ...i.facts,
        byProfessional: true, // Sward records the work of lawn-care companies
        nPct: i.product.nPct,
        nLb: per1000.nLb,
        wsnLb: per1000.wsnLb,
        p2o5Lb: per1000.p2o5Lb,
        slowReleasePctOfN: i.product.slowReleasePctOfN,
      })
    : [];
  const unitLb = labelUnitLb(i.product);
  findings.push(
    ...checkLabel(
      {
        productName: i.product.name,
        registrationNumber: i.product.registrationNumber,
        unitLabel: i.product.labelRateUnit ? RATE_UNIT_LABEL[i.product.labelRateUnit] : "",
        lbPer1000PerUnit: unitLb ?? 1,
        maxRate: unitLb === null ? null : i.product.labelMaxRate,
        maxYearly: unitLb === null ? null : i.product.labelMaxYearly,
        minIntervalDays: i.product.labelMinIntervalDays,
      },
      { appliedOn: i.facts.appliedOn, productLbPer1000: lb, others: i.sameProductOnZone },
    ),
  );
  findings.push(...labelConditions(i.product.name, i.product.labelCautions, i.facts.weather));
  if (i.zoneTreatments)
    findings.push(
      ...seedingFindings({
        application: { ...treatmentOf(i.product, i.facts.appliedOn), productLbPer1000: lb },
        others: i.zoneTreatments,
        zone: { speciesKey: i.zoneSpecies ?? "", areaFt2: i.areaFt2 },
        isEstablishing: i.facts.isEstablishing,
        formatDate: i.formatDate ?? ((d) => d),
      }),
    );
  return {
    per1000,
    totals,
    productLbPer1000: lb,
    findings,
    refused: isRefused(findings),
    labelRefused: isLabelRefused(findings),
  };
}
