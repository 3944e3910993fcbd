// A fertiliser rule set as screens show it (and as lib/agronomy/rules.ts checks it).
import type { RuleSetLimits } from "@/lib/agronomy/rules";
import type { RecordField } from "@/lib/reference/record-fields";

export interface RuleSetDto extends RuleSetLimits {
  id: string;
  recordRetentionYears: number;
  recordRequiredFields: RecordField[];
  recordFieldsApplyTo: "pesticides" | "all";
}
