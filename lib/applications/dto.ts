// An application as it leaves the server.
import type { RateUnit } from "@/lib/agronomy/nutrients";
import type { RuleFinding } from "@/lib/agronomy/rules";

import type { OverrideCategory } from "./units";

export interface ApplicationDto {
  id: string;
  visitId: string;
  zoneId: string;
  product: {
    id: string;
    name: string;
    isPesticide: boolean;
    registrationNumber: string;
    labelCautions: string;
    reentryGuidance: string;
  };
  rate: { amount: number; unit: RateUnit };
  areaFt2: number;
  productTotalLb: number;
  productTotalGal: number | null;
  per1000: { nLb: number; p2o5Lb: number; k2oLb: number; wsnLb: number };
  appliedAt: string;
  appliedOn: string;
  windMph: number | null;
  temperatureF: number | null;
  isEstablishing: boolean;
  isRepairing: boolean;
  applicatorName: string;
  applicatorLicence: string;
  findings: RuleFinding[];
  overrideReason: string | null;
  overrideCategory: OverrideCategory | null;
  overrideBy: string | null;
  /** Who recorded it: they may correct or delete it while the visit is open. */
  createdById: string | null;
}
