// A fertiliser rule set as screens show it (and as lib/agronomy/rules.ts checks it).
import type { RecordField } from "@/fixtures/record-fields";
import type { RuleSetLimits } from "@/lib/agronomy/rules";

export interface RuleSetDto extends RuleSetLimits {
  id: string;
  recordRetentionYears: number;
  recordRequiredFields: RecordField[];
  recordFieldsApplyTo: "pesticides" | "all";
}
