"use client";

// A zone check changed on another device while this phone had changes: both copies side by
// side, field by field where they differ; the technician keeps theirs (sent again on the server's
// current version) or takes the server's. Nothing is replaced without that choice.
import { useTranslations } from "next-intl";

import { Button } from "@/components/ui/button";
import type { ZoneCheckDto, ZoneCheckValues } from "@/lib/visits/dto";

const FIELDS = [
  "status",
  "quality",
  "color",
  "density",
  "uniformity",
  "barePct",
  "weedsPct",
  "thatchIn",
  "soilMoisture",
  "soilMoisturePct",
  "heightOfCutIn",
  "mowedToday",
  "heightBeforeMowingIn",
  "mowingDirection",
  "isMatted",
  "isScalped",
  "hasTornTips",
  "hasClumpedClippings",
  "symptoms",
  "notes",
  "skipReason",
  "skipNote",
] as const satisfies readonly (keyof ZoneCheckValues)[];

/** The fields whose values differ between two copies of a zone check (pure). */
function differingFields(
  theirs: ZoneCheckValues,
  mine: ZoneCheckValues,
): (typeof FIELDS)[number][] {
  return FIELDS.filter((f) => JSON.stringify(theirs[f]) !== JSON.stringify(mine[f]));
}

export function ConflictPanel({
  theirs,
  mine,
  onKeepMine,
  onUseTheirs,
}: {
  theirs: ZoneCheckDto;
  mine: ZoneCheckValues;
  onKeepMine: () => void;
  onUseTheirs: () => void;
}) {
  const t = useTranslations("offline");
  const a = useTranslations("audit");
  const show = (value: unknown): string => {
    if (value === null || value === undefined || value === "") return a("blank");
    if (typeof value === "boolean") return value ? a("yes") : a("no");
    if (Array.isArray(value)) return a("symptoms", { count: value.length });
    return String(value);
  };
  const fields = differingFields(theirs, mine);
  return (
    <div
      role="alert"
      className="space-y-3 rounded-xl border-2 border-clay bg-clay-tint p-4 text-ink"
      data-conflict
    >
      <p className="font-bold text-clay">{t("conflictTitle")}</p>
      <table className="w-full table-fixed text-left text-sm" aria-label={t("conflictTitle")}>
        <thead>
          <tr>
            <th scope="col" className="py-1 pr-2">
              {t("conflictField")}
            </th>
            <th scope="col" className="py-1 pr-2">
              {t("conflictTheirs", { who: theirs.updatedBy ?? "—" })}
            </th>
            <th scope="col" className="py-1">
              {t("conflictMine")}
            </th>
          </tr>
        </thead>
        <tbody>
          {fields.map((f) => (
            <tr key={f} className="border-t border-line align-top">
              <th scope="row" className="py-1 pr-2 font-semibold">
                {a(`fields.${f}`)}
              </th>
              <td className="py-1 pr-2 break-words">{show(theirs[f])}</td>
              <td className="py-1 break-words">{show(mine[f])}</td>
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={onKeepMine}>
          {t("keepMine")}
        </Button>
        <Button type="button" variant="secondary" onClick={onUseTheirs}>
          {t("useTheirs")}
        </Button>
      </div>
    </div>
  );
}
