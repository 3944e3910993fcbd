"use client";

// The company's season programs (manager): each in words — its rounds, windows and targets — with
// editing in place, a new program, and deleting one no property follows.
import { CalendarRange, PencilLine, Plus, Trash2 } from "lucide-react";
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { monthDayWords } from "@/lib/agronomy/rules";
import type { ProgramDto, ProgramMethodDto, ProgramWindowDto } from "@/lib/programs/dto";
import { sendJson } from "@/lib/query-client";

import { ProgramEditor, type ProgramProduct } from "./program-editor";

function windowWords(w: ProgramWindowDto): string {
  switch (w.kind) {
    case "dates":
      return `${monthDayWords(w.startMd)} to ${monthDayWords(w.endMd)}`;
    case "gdd":
      return `${w.days} days from ${w.value.toLocaleString("en-US")} GDD (base ${w.baseF} °F)`;
    case "soil_temperature":
      return `${w.days} days from soil at ${w.value} °F`;
    case "air_temperature":
      return `${w.days} days from a mean air temperature of ${w.value} °F`;
  }
}

export function ProgramList({
  programs,
  products,
}: {
  programs: ProgramDto[];
  products: ProgramProduct[];
}) {
  const t = useTranslations("terms");
  const router = useRouter();
  const [editing, setEditing] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);
  const productName = (id: string | null) => products.find((p) => p.id === id)?.name ?? null;
  const methodWords = (m: ProgramMethodDto) => {
    const product = productName(m.productId);
    const target =
      m.target === "lb" ? `${m.nLb?.toFixed(2)} lb N / 1,000 ft²` : t(`programTargets.${m.target}`);
    // "From growth potential" reads in lower case after the product; "lb N" keeps its capital.
    return product ? `${product}, ${m.target === "lb" ? target : target.toLowerCase()}` : target;
  };
  async function remove(program: ProgramDto) {
    if (!window.confirm(`Delete the program ${program.name}?`)) return;
    setError(null);
    const result = await sendJson("DELETE", `/api/v1/programs/${program.id}`);
    if (!result.ok) setError(result.error.message);
    else router.refresh();
  }
  return (
    <div className="space-y-3">
      {error ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {error}
        </p>
      ) : null}
      {editing === "new" ? (
        <ProgramEditor products={products} onDone={() => setEditing(null)} />
      ) : (
        <Button type="button" onClick={() => setEditing("new")}>
          <Plus className="size-5" aria-hidden="true" /> New program
        </Button>
      )}
      {programs.length === 0 && editing !== "new" ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No programs yet. A program is the season&apos;s rounds; each property follows one.
        </p>
      ) : null}
      <ul className="space-y-3" aria-label="Programs">
        {programs.map((program) =>
          editing === program.id ? (
            <li key={program.id}>
              <ProgramEditor
                program={program}
                products={products}
                onDone={() => setEditing(null)}
              />
            </li>
          ) : (
            <li key={program.id} className="rounded-xl border border-line bg-card p-4">
              <h2 className="flex flex-wrap items-center gap-2 text-xl font-bold">
                <CalendarRange className="size-5 text-sward" aria-hidden="true" />
                {program.name}
                <span className="text-sm font-semibold text-muted">
                  · {program.grassSeason === "cool" ? "cool-season" : "warm-season"} ·{" "}
                  {program.propertyCount === 1
                    ? "1 property follows it"
                    : `${program.propertyCount} properties follow it`}
                </span>
              </h2>
              {program.notes ? <p className="mt-1">{program.notes}</p> : null}
              <ol className="mt-3 space-y-2">
                {program.rounds.map((r) => (
                  <li key={r.position} className="rounded-lg bg-paper p-2">
                    <p className="font-semibold">
                      {r.position}. {t(`programRoundKinds.${r.kind}`)} —{" "}
                      <span className="font-normal">{windowWords(r.window)}</span>
                    </p>
                    <p className="text-sm">
                      Granular: {methodWords(r.granular)} · Liquid: {methodWords(r.liquid)}
                    </p>
                  </li>
                ))}
              </ol>
              <div className="mt-3 flex flex-wrap gap-2">
                <Button type="button" variant="secondary" onClick={() => setEditing(program.id)}>
                  <PencilLine className="size-5" aria-hidden="true" /> Edit
                </Button>
                <Button type="button" variant="secondary" onClick={() => remove(program)}>
                  <Trash2 className="size-5" aria-hidden="true" /> Delete
                </Button>
              </div>
            </li>
          ),
        )}
      </ul>
    </div>
  );
}
