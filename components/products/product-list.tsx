"use client";

// The product catalogue with inline editing (manager), read and changed through React Query.
import { Archive, PencilLine, Plus } from "lucide-react";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { RATE_UNIT_LABEL } from "@/lib/applications/units";
import type { ProductDto } from "@/lib/products/dto";

import { ProductEditor } from "./product-editor";
import { useArchiveProduct, useProducts } from "./use-products";

const FORM = { granular: "Granular", liquid: "Liquid", soluble: "Soluble powder" } as const;

export function ProductList() {
  const { data: products = [], error } = useProducts();
  const archiveProduct = useArchiveProduct();
  const [editing, setEditing] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  async function archive(p: ProductDto) {
    if (
      !window.confirm(
        `Archive ${p.name}? Past applications keep it; it leaves the list for new ones.`,
      )
    )
      return;
    setMessage(null);
    const result = await archiveProduct.mutateAsync(p.id);
    if (!result.ok) setMessage(result.error.message);
  }
  return (
    <div className="space-y-3">
      {message || error ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {message ?? error?.message}
        </p>
      ) : null}
      {editing === "new" ? (
        <ProductEditor onDone={() => setEditing(null)} />
      ) : (
        <Button type="button" onClick={() => setEditing("new")}>
          <Plus className="size-5" aria-hidden="true" />
          Add a product
        </Button>
      )}
      <ul className="space-y-3" aria-label="Products">
        {products.map((p) =>
          editing === p.id ? (
            <li key={p.id}>
              <ProductEditor product={p} onDone={() => setEditing(null)} />
            </li>
          ) : (
            <li key={p.id} className="rounded-xl border border-line bg-card p-4">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h2 className="text-lg font-bold">{p.name}</h2>
                <p className="font-semibold">
                  {p.nPct}-{p.p2o5Pct}-{p.k2oPct}
                </p>
              </div>
              <p className="text-muted">
                {FORM[p.form]}
                {p.slowReleasePctOfN
                  ? ` · ${p.slowReleasePctOfN} % of N ${p.nRelease === "organic" ? "water-insoluble" : "slow-release"}`
                  : p.nPct > 0
                    ? " · all N water-soluble"
                    : ""}
                {p.densityLbPerGal ? ` · ${p.densityLbPerGal} lb/gal` : ""}
                {p.isPesticide ? ` · pesticide, reg. ${p.registrationNumber}` : ""}
              </p>
              <p className="mt-1 text-sm">
                {p.labelMaxRate !== null && p.labelRateUnit
                  ? `Label: at most ${p.labelMaxRate} ${RATE_UNIT_LABEL[p.labelRateUnit]} per application${p.labelMaxYearly !== null ? `, ${p.labelMaxYearly} ${RATE_UNIT_LABEL[p.labelRateUnit]} in any 365 days` : ""}${p.labelMinIntervalDays !== null ? `, at least ${p.labelMinIntervalDays} days between applications` : ""}.`
                  : "No label limits entered: applications of it are checked only against the rule set."}
              </p>
              {p.reentryGuidance ? (
                <p className="mt-1 text-sm">
                  <span className="font-semibold">Keep off treated turf:</span> {p.reentryGuidance}
                </p>
              ) : null}
              {p.labelCautions ? <p className="mt-2 text-sm">{p.labelCautions}</p> : null}
              <div className="mt-3 flex gap-2">
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => setEditing(p.id)}
                  aria-label={`Edit ${p.name}`}
                >
                  <PencilLine className="size-5" aria-hidden="true" /> Edit
                </Button>
                <Button
                  type="button"
                  variant="quiet"
                  onClick={() => archive(p)}
                  aria-label={`Archive ${p.name}`}
                >
                  <Archive className="size-5" aria-hidden="true" /> Archive
                </Button>
              </div>
            </li>
          ),
        )}
      </ul>
    </div>
  );
}
