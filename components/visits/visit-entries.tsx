"use client";

// What was done on a visit, entry by entry — applications (product, rate in the label's units,
// area, the nutrients it brought, time), waterings — with Correct and Delete for whoever may use
// them: the entry's author while the visit is open, a manager (with a reason, audited) once it is
// finished. After a change the visit and its audit trail are read again at once (the queries are
// invalidated), so the trail shows the correction without a reload.
import { useQueryClient } from "@tanstack/react-query";
import { PencilLine, Trash2 } from "lucide-react";
import { useCallback, useState } from "react";

import { Button } from "@/components/ui/button";
import { formatAreaFt2 } from "@/components/ui/format";
import type { ApplicationDto } from "@/lib/applications/dto";
import { OVERRIDE_CATEGORY_LABEL, RATE_UNIT_LABEL } from "@/lib/applications/units";
import { formatDateTimeWithYear, formatShortDate } from "@/lib/dates";
import type { PhotoDto } from "@/lib/photos/dto";
import { sendJson, type SendResult } from "@/lib/query-client";
import type { VisitDetailDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";
import type { WateringDto } from "@/lib/watering/dto";

import { CorrectionDialog } from "./correction-dialog";

const f2 = (x: number) => x.toFixed(2);

/** Reads the visit and its trail again (after a correction). */
function useRefreshVisit(visitId: string) {
  const queryClient = useQueryClient();
  return useCallback(async () => {
    await Promise.all([
      queryClient.invalidateQueries({ queryKey: visitKeys.detail(visitId) }),
      queryClient.invalidateQueries({ queryKey: visitKeys.audit(visitId) }),
    ]);
  }, [queryClient, visitId]);
}

/** Who may change an entry: a manager always (with a reason once finished), its author while the visit is open. */
export function mayChange(
  visit: Pick<VisitDetailDto, "status" | "viewerId" | "canEdit">,
  isManager: boolean,
  authorId: string | null,
): boolean {
  if (visit.status === "cancelled") return false;
  if (isManager) return true;
  return visit.status !== "completed" && visit.canEdit && authorId === visit.viewerId;
}

/** The nutrients an application brought, only those it has (an insecticide brings none). */
function nutrientWords(a: ApplicationDto): string {
  const parts = [
    a.per1000.nLb > 0
      ? `${f2(a.per1000.nLb)} lb N${a.per1000.wsnLb > 0 ? ` (${f2(a.per1000.wsnLb)} water-soluble)` : ""}`
      : null,
    a.per1000.p2o5Lb > 0 ? `${f2(a.per1000.p2o5Lb)} lb P₂O₅` : null,
    a.per1000.k2oLb > 0 ? `${f2(a.per1000.k2oLb)} lb K₂O` : null,
  ].filter(Boolean);
  return parts.length ? `${parts.join(", ")} per 1,000 ft²` : "no nutrients";
}

function applicationBody(a: ApplicationDto, rateAmount: number, reason: string | null) {
  return {
    zoneId: a.zoneId,
    productId: a.product.id,
    rateAmount,
    rateUnit: a.rate.unit,
    windMph: a.windMph,
    temperatureF: a.temperatureF,
    isEstablishing: a.isEstablishing,
    isRepairing: a.isRepairing,
    applicatorName: a.applicatorName,
    applicatorLicence: a.applicatorLicence,
    overrideReason: a.overrideReason,
    overrideCategory: a.overrideCategory,
    correctionReason: reason,
  };
}

type Editing =
  | { kind: "correct-application"; application: ApplicationDto }
  | { kind: "delete-application"; application: ApplicationDto }
  | { kind: "delete-photo"; photo: PhotoDto }
  | { kind: "correct-watering"; watering: WateringDto }
  | { kind: "delete-watering"; watering: WateringDto }
  | null;

/** The dialogs behind the Correct and Delete buttons, for one visit. */
export function useEntryDialogs(visit: VisitDetailDto) {
  const [editing, setEditing] = useState<Editing>(null);
  const [amount, setAmount] = useState("");
  const refresh = useRefreshVisit(visit.id);
  const needsReason = visit.status === "completed";
  const close = () => setEditing(null);
  const after = async (sent: Promise<SendResult<unknown>>): Promise<SendResult<unknown>> => {
    const result = await sent;
    if (result.ok) await refresh();
    return result;
  };

  const open = (next: Exclude<Editing, null>) => {
    if (next.kind === "correct-application") setAmount(String(next.application.rate.amount));
    if (next.kind === "correct-watering") setAmount(String(next.watering.depthIn));
    setEditing(next);
  };

  let dialog: React.ReactNode = null;
  if (editing?.kind === "correct-application") {
    const a = editing.application;
    dialog = (
      <CorrectionDialog
        title={`Correct the application of ${a.product.name}`}
        confirmLabel="Save the correction"
        needsReason={needsReason}
        onClose={close}
        onConfirm={(reason) =>
          after(
            sendJson(
              "PUT",
              `/api/v1/applications/${a.id}`,
              applicationBody(a, Number(amount), reason),
            ),
          )
        }
      >
        <label className="block">
          <span className="mb-1 block font-semibold">Rate ({RATE_UNIT_LABEL[a.rate.unit]})</span>
          <input
            type="number"
            inputMode="decimal"
            step="any"
            min={0}
            value={amount}
            onChange={(e) => setAmount(e.target.value)}
            className="min-h-tap w-full rounded-lg border border-line bg-paper px-3"
          />
          <span className="block text-sm text-muted">
            The corrected record is checked again against the label and the rule set, as a new one
            is. Follow the product label and local rules.
          </span>
        </label>
      </CorrectionDialog>
    );
  } else if (editing?.kind === "delete-application") {
    const a = editing.application;
    dialog = (
      <CorrectionDialog
        title={`Delete the application of ${a.product.name}?`}
        confirmLabel="Delete application"
        needsReason={needsReason}
        onClose={close}
        onConfirm={(reason) =>
          after(sendJson("DELETE", `/api/v1/applications/${a.id}`, { correctionReason: reason }))
        }
      >
        <p>
          {a.rate.amount} {RATE_UNIT_LABEL[a.rate.unit]} on {formatAreaFt2(a.areaFt2)}. The
          zone&apos;s nitrogen this year no longer counts it.
        </p>
      </CorrectionDialog>
    );
  } else if (editing?.kind === "delete-photo") {
    dialog = (
      <CorrectionDialog
        title="Delete this photo?"
        confirmLabel="Delete photo"
        needsReason={needsReason}
        onClose={close}
        onConfirm={(reason) =>
          after(
            sendJson("DELETE", `/api/v1/photos/${editing.photo.id}`, { correctionReason: reason }),
          )
        }
      >
        <p>Its cover and color leave the zone&apos;s Sward Index.</p>
      </CorrectionDialog>
    );
  } else if (editing?.kind === "correct-watering") {
    const w = editing.watering;
    dialog = (
      <CorrectionDialog
        title="Correct the watering"
        confirmLabel="Save the correction"
        needsReason={needsReason}
        onClose={close}
        onConfirm={(reason) =>
          after(
            sendJson("PUT", `/api/v1/waterings/${w.id}`, {
              id: w.id,
              zoneId: w.zoneId,
              wateredOn: w.wateredOn,
              depthIn: Number(amount),
              runMinutes: null,
              precipitationRateInPerHour: null,
              notes: w.notes,
              visitId: w.visitId,
              correctionReason: reason,
            }),
          )
        }
      >
        <label className="block">
          <span className="mb-1 block font-semibold">Depth (in of water)</span>
          <input
            type="number"
            inputMode="decimal"
            step="any"
            min={0}
            value={amount}
            onChange={(e) => setAmount(e.target.value)}
            className="min-h-tap w-full rounded-lg border border-line bg-paper px-3"
          />
        </label>
      </CorrectionDialog>
    );
  } else if (editing?.kind === "delete-watering") {
    const w = editing.watering;
    dialog = (
      <CorrectionDialog
        title="Delete this watering?"
        confirmLabel="Delete watering"
        needsReason={needsReason}
        onClose={close}
        onConfirm={(reason) =>
          after(sendJson("DELETE", `/api/v1/waterings/${w.id}`, { correctionReason: reason }))
        }
      >
        <p>
          {w.depthIn.toFixed(2)} in on {formatShortDate(w.wateredOn)}.
        </p>
      </CorrectionDialog>
    );
  }
  return { open, dialog };
}

export function ApplicationEntry({
  application: a,
  timeZone,
  canChange,
  onCorrect,
  onDelete,
}: {
  application: ApplicationDto;
  timeZone: string;
  canChange: boolean;
  onCorrect: () => void;
  onDelete: () => void;
}) {
  return (
    <li className="rounded-lg border border-line bg-card p-3 text-sm">
      <p className="font-bold">
        {a.product.name}: {a.rate.amount} {RATE_UNIT_LABEL[a.rate.unit]}
      </p>
      <p>
        {nutrientWords(a)} · {f2(a.productTotalLb)} lb product on {formatAreaFt2(a.areaFt2)} ·{" "}
        <time dateTime={a.appliedAt}>{formatDateTimeWithYear(a.appliedAt, timeZone)}</time>
      </p>
      {a.overrideReason ? (
        <p className="mt-1 font-semibold text-clay">
          Legal limit overridden by {a.overrideBy}
          {a.overrideCategory ? ` (${OVERRIDE_CATEGORY_LABEL[a.overrideCategory]})` : ""}:{" "}
          {a.overrideReason}
        </p>
      ) : null}
      {canChange ? (
        <div className="mt-2 flex flex-wrap gap-2">
          <Button
            type="button"
            variant="secondary"
            onClick={onCorrect}
            aria-label={`Correct the application of ${a.product.name}`}
          >
            <PencilLine className="size-5" aria-hidden="true" />
            Correct
          </Button>
          <Button
            type="button"
            variant="secondary"
            onClick={onDelete}
            aria-label={`Delete the application of ${a.product.name}`}
          >
            <Trash2 className="size-5" aria-hidden="true" />
            Delete
          </Button>
        </div>
      ) : null}
    </li>
  );
}

export function WateringEntries({
  visit,
  isManager,
  onCorrect,
  onDelete,
}: {
  visit: VisitDetailDto;
  isManager: boolean;
  onCorrect: (w: WateringDto) => void;
  onDelete: (w: WateringDto) => void;
}) {
  if (!visit.waterings.length) return null;
  return (
    <section className="mt-6" aria-labelledby="visit-waterings-title">
      <h2 id="visit-waterings-title" className="mb-2 text-xl font-bold">
        Waterings recorded on this visit
      </h2>
      <ul className="space-y-2">
        {visit.waterings.map((w) => (
          <li key={w.id} className="rounded-lg border border-line bg-card p-3 text-sm">
            <p className="font-bold">
              {w.depthIn.toFixed(2)} in of water · {w.zoneName ?? "whole property"} ·{" "}
              {formatShortDate(w.wateredOn)}
            </p>
            {w.notes ? <p>{w.notes}</p> : null}
            {mayChange(visit, isManager, w.enteredById) ? (
              <div className="mt-2 flex flex-wrap gap-2">
                <Button type="button" variant="secondary" onClick={() => onCorrect(w)}>
                  <PencilLine className="size-5" aria-hidden="true" />
                  Correct
                </Button>
                <Button type="button" variant="secondary" onClick={() => onDelete(w)}>
                  <Trash2 className="size-5" aria-hidden="true" />
                  Delete
                </Button>
              </div>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
