"use client";

// Symptoms from the catalogue: tap to add, then severity 1–3 and extent (% of zone).
import { Plus, X } from "lucide-react";
import { useState } from "react";

import { ChoiceGroup } from "@/components/ui/choice-group";
import { Stepper } from "@/components/ui/stepper";
import type { ObservedSymptom } from "@/db/schema";
import {
  findSymptom,
  SYMPTOM_KIND_LABEL,
  symptoms,
  type SymptomKind,
} from "@/lib/reference/symptoms";

const SEVERITY = [
  { value: 1, label: "1 light" },
  { value: 2, label: "2 moderate" },
  { value: 3, label: "3 severe" },
];

export function SymptomPicker({
  value,
  onChange,
  disabled,
}: {
  value: ObservedSymptom[];
  onChange: (next: ObservedSymptom[]) => void;
  disabled: boolean;
}) {
  const [isOpen, setIsOpen] = useState(false);
  const chosen = new Set(value.map((s) => s.key));
  const update = (key: string, patch: Partial<ObservedSymptom>) =>
    onChange(value.map((s) => (s.key === key ? { ...s, ...patch } : s)));

  return (
    <div className="space-y-3">
      {value.length === 0 ? <p className="text-muted">No symptoms recorded.</p> : null}
      <ul className="space-y-3">
        {value.map((s) => (
          <li key={s.key} className="space-y-3 rounded-lg border-2 border-sun bg-sun-tint p-3">
            <div className="flex items-start justify-between gap-2">
              <div>
                <p className="font-bold">{findSymptom(s.key)?.name ?? s.key}</p>
                <p className="text-sm">{findSymptom(s.key)?.signs}</p>
              </div>
              <button
                type="button"
                disabled={disabled}
                onClick={() => onChange(value.filter((x) => x.key !== s.key))}
                className="grid size-11 shrink-0 place-items-center rounded-lg border border-line bg-card"
                aria-label={`Remove ${findSymptom(s.key)?.name ?? s.key}`}
              >
                <X className="size-5" aria-hidden="true" />
              </button>
            </div>
            <ChoiceGroup
              label="Severity"
              choices={SEVERITY}
              value={s.severity}
              allowClear={false}
              onChange={(v) => v && update(s.key, { severity: v as 1 | 2 | 3 })}
            />
            <div>
              <p className="mb-1 text-sm font-semibold">Extent (share of the zone)</p>
              <Stepper
                label="Extent"
                value={s.extentPct}
                onChange={(v) => update(s.key, { extentPct: v ?? 0 })}
                step={5}
                min={0}
                max={100}
                startAt={5}
                unit="%"
              />
            </div>
          </li>
        ))}
      </ul>
      {isOpen ? (
        <div className="space-y-4 rounded-lg border border-line bg-paper p-3">
          {(Object.keys(SYMPTOM_KIND_LABEL) as SymptomKind[]).map((kind) => (
            <div key={kind}>
              <p className="mb-2 font-bold">{SYMPTOM_KIND_LABEL[kind]}</p>
              <div className="flex flex-wrap gap-2">
                {symptoms
                  .filter((s) => s.kind === kind && !chosen.has(s.key))
                  .map((s) => (
                    <button
                      key={s.key}
                      type="button"
                      disabled={disabled}
                      onClick={() => {
                        onChange([...value, { key: s.key, severity: 1, extentPct: 5 }]);
                        setIsOpen(false);
                      }}
                      className="min-h-tap rounded-lg border border-line bg-card px-3 py-2 font-semibold hover:border-sward"
                    >
                      {s.name}
                    </button>
                  ))}
              </div>
            </div>
          ))}
          <button
            type="button"
            onClick={() => setIsOpen(false)}
            className="min-h-tap font-semibold underline"
          >
            Close the list
          </button>
        </div>
      ) : (
        <button
          type="button"
          disabled={disabled}
          onClick={() => setIsOpen(true)}
          className="inline-flex min-h-tap items-center gap-2 rounded-lg border-2 border-dashed border-line bg-card px-4 py-2 font-semibold"
        >
          <Plus className="size-5" aria-hidden="true" />
          Add a symptom
        </button>
      )}
    </div>
  );
}
