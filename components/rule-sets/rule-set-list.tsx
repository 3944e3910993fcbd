"use client";

// The company's rule sets, in words, with inline editing (manager), read through React Query.
import { Gavel, PencilLine, Plus } from "lucide-react";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { monthDayWords } from "@/lib/agronomy/rules";
import { RECORD_FIELDS } from "@/lib/reference/record-fields";
import type { RuleSetDto } from "@/lib/rule-sets/dto";

import { RuleSetEditor } from "./rule-set-editor";
import { useRuleSets } from "./use-rule-sets";

function describe(r: RuleSetDto): string[] {
  const out: string[] = [];
  if (r.maxNLbPer1000 !== null)
    out.push(`at most ${r.maxNLbPer1000} lb N per 1,000 ft² per application`);
  if (r.maxWsnLbPer1000 !== null) out.push(`at most ${r.maxWsnLbPer1000} lb water-soluble N`);
  if (r.minSlowReleasePct !== null) out.push(`at least ${r.minSlowReleasePct} % slow-release N`);
  if (r.proBlackout)
    out.push(
      `no fertilizer by professionals after ${monthDayWords(r.proBlackout[0])} or before ${monthDayWords(r.proBlackout[1])}`,
    );
  if (r.homeownerBlackout)
    out.push(
      `no fertilizer by homeowners after ${monthDayWords(r.homeownerBlackout[0])} or before ${monthDayWords(r.homeownerBlackout[1])}`,
    );
  if (r.conditionsSource) out.push("not on frozen or saturated ground, nor before heavy rain");
  if (r.phosphorusRule === "soil_test_or_establishment") {
    const exempt = [
      r.phosphorusExemptEstablishment ? "first establishment" : "",
      r.phosphorusExemptRepair ? "repair" : "",
    ].filter(Boolean);
    out.push(
      `phosphorus only with a soil test${r.soilTestMaxAgeYears ? ` no more than ${r.soilTestMaxAgeYears} years old` : ""}${exempt.length ? ` or for ${exempt.join(" or ")}` : ""}`,
    );
  }
  out.push(
    `records kept ${r.recordRetentionYears} years; ${r.recordRequiredFields.length ? `${r.recordFieldsApplyTo === "all" ? "every application" : "pesticide applications"} need ${r.recordRequiredFields.map((f) => RECORD_FIELDS[f].toLowerCase()).join(", ")}` : "no extra record fields"}`,
  );
  return out;
}

export function RuleSetList() {
  const { data: ruleSets = [], error } = useRuleSets();
  const [editing, setEditing] = useState<string | null>(null);
  return (
    <div className="space-y-3">
      {error ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {error.message}
        </p>
      ) : null}
      {editing === "new" ? (
        <RuleSetEditor onDone={() => setEditing(null)} />
      ) : (
        <Button type="button" onClick={() => setEditing("new")}>
          <Plus className="size-5" aria-hidden="true" /> Add a rule set
        </Button>
      )}
      <ul className="space-y-3" aria-label="Rule sets">
        {ruleSets.map((r) =>
          editing === r.id ? (
            <li key={r.id}>
              <RuleSetEditor ruleSet={r} onDone={() => setEditing(null)} />
            </li>
          ) : (
            <li key={r.id} className="rounded-xl border border-line bg-card p-4">
              <h2 className="flex items-center gap-2 text-lg font-bold">
                {r.limitsAreLaw ? <Gavel className="size-5 text-clay" aria-hidden="true" /> : null}
                {r.name}
                <span className="text-sm font-semibold text-muted">
                  {r.limitsAreLaw ? "· law: breaches are refused" : "· advice: breaches warn"}
                </span>
              </h2>
              <ul className="mt-2 list-disc pl-5">
                {describe(r).map((line) => (
                  <li key={line}>{line}</li>
                ))}
              </ul>
              <p className="mt-2 text-sm text-muted">{r.citation}</p>
              <Button
                type="button"
                variant="secondary"
                className="mt-3"
                onClick={() => setEditing(r.id)}
                aria-label={`Edit ${r.name}`}
              >
                <PencilLine className="size-5" aria-hidden="true" /> Edit
              </Button>
            </li>
          ),
        )}
      </ul>
    </div>
  );
}
