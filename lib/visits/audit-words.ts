// A visit's audit trail in words: each event becomes one sentence from the catalogue
// (lib/i18n/messages/en.ts, "audit"), e.g. "Front lawn · color 6 → 8 — corrected by Dana
// Whitcombe: misread in shade", and its moment through lib/dates.ts in the company's locale. No
// raw field name or stored value (snake_case, enum keys, ISO dates) reaches the sentence.
//
// How events are stored (lib/audit/record.ts): `changes` maps a field to { from, to }; an entry
// whose from and to are equal is context (the product an application was of), not a change; an
// added entry has from null, a removed one to null. Actions: add_after_finish, edit,
// edit_after_finish, delete, delete_after_finish, rain_out and cancel (a stop called off, its
// reason in the event's reason), reschedule, and the older finish, override_legal_limit,
// applied_at_differs.
import { OVERRIDE_CATEGORY_LABEL, RATE_UNIT_LABEL } from "@/lib/applications/units";
import { formatDateTimeWithYear, formatShortDate, isIsoDate } from "@/lib/dates";
import { translator } from "@/lib/i18n/translate";
import { findSymptom } from "@/lib/reference/symptoms";
import { MOWING_DIRECTION, SKIP_REASONS, SOIL_MOISTURE } from "@/lib/reference/visit-options";

export interface AuditEventFacts {
  at: string;
  actor: string | null;
  entity: string;
  action: string;
  changes: Record<string, { from: unknown; to: unknown }>;
  reason: string | null;
  /** The zone's name, when the event is about a zone. */
  zoneName: string | null;
}

export interface AuditEventWords {
  /** "Dec 2, 2026, 3:05 PM" in the company's locale and the property's time zone. */
  when: string;
  sentence: string;
}

const NOTE_LENGTH = 80;

type T = ReturnType<typeof translator<"audit">>;

function fieldWord(t: T, field: string): string {
  const key = `fields.${field}`;
  if (t.has(key as never)) return t(key as never);
  // A field without a word yet: its name as words ("heightOfCutIn" → "height of cut in").
  return field
    .replace(/([a-z0-9])([A-Z])/g, "$1 $2")
    .replaceAll("_", " ")
    .toLowerCase();
}

function rateWords(value: unknown, locale: string): string | null {
  if (!value || typeof value !== "object") return null;
  const { amount, unit } = value as { amount?: unknown; unit?: unknown };
  if (typeof amount !== "number" || typeof unit !== "string") return null;
  const label = RATE_UNIT_LABEL[unit as keyof typeof RATE_UNIT_LABEL] ?? unit.replaceAll("_", " ");
  return `${new Intl.NumberFormat(locale, { maximumFractionDigits: 3 }).format(amount)} ${label}`;
}

/** One stored value in words, by its field. */
export function valueWords(
  field: string,
  value: unknown,
  options: { timeZone: string; locale?: string },
): string {
  const locale = options.locale ?? "en-US";
  const t = translator(locale, "audit");
  if (value === null || value === undefined || value === "") return t("blank");
  if (typeof value === "boolean") return value ? t("yes") : t("no");
  if (typeof value === "number")
    return new Intl.NumberFormat(locale, { maximumFractionDigits: 3 }).format(value);
  if (field === "rate") return rateWords(value, locale) ?? t("blank");
  if (field === "symptoms" && Array.isArray(value)) {
    if (!value.length) return t("symptoms", { count: 0 });
    return value
      .map((s: unknown) => {
        const key = typeof s === "object" && s && "key" in s ? String(s.key) : String(s);
        return findSymptom(key)?.name ?? key.replaceAll("_", " ");
      })
      .join(", ");
  }
  if (typeof value === "string") {
    if (field === "status" && ["draft", "done", "skipped"].includes(value))
      return t(`checkStatus.${value as "draft" | "done" | "skipped"}`);
    if (field === "skipReason" && value in SKIP_REASONS)
      return SKIP_REASONS[value as keyof typeof SKIP_REASONS];
    if (field === "soilMoisture" && value in SOIL_MOISTURE)
      return SOIL_MOISTURE[value as keyof typeof SOIL_MOISTURE].toLowerCase();
    if (field === "mowingDirection" && value in MOWING_DIRECTION)
      return MOWING_DIRECTION[value as keyof typeof MOWING_DIRECTION].toLowerCase();
    if (field === "category" && value in OVERRIDE_CATEGORY_LABEL)
      return OVERRIDE_CATEGORY_LABEL[value as keyof typeof OVERRIDE_CATEGORY_LABEL];
    if (field === "rateUnit" && value in RATE_UNIT_LABEL)
      return RATE_UNIT_LABEL[value as keyof typeof RATE_UNIT_LABEL];
    if (isIsoDate(value)) return formatShortDate(value, locale);
    if (/^\d{4}-\d{2}-\d{2}T/.test(value) && !Number.isNaN(Date.parse(value)))
      return formatDateTimeWithYear(value, options.timeZone, locale);
    // A stored key without a word (an enum value added later): its words, never the key.
    if (/^[a-z0-9]+(_[a-z0-9]+)+$/.test(value)) return value.replaceAll("_", " ");
    // Free text (notes, names): quoted, cut to a line.
    const text = value.length > NOTE_LENGTH ? `${value.slice(0, NOTE_LENGTH - 1)}…` : value;
    return `“${text}”`;
  }
  if (Array.isArray(value))
    return value.map((v) => valueWords(field, v, options)).join(", ") || t("blank");
  if (typeof value === "object")
    return (
      rateWords(value, locale) ??
      Object.values(value)
        .map((v) => valueWords(field, v, options))
        .join(", ")
    );
  return t("blank");
}

/** "color 6 → 8, density 5 → 6": the entries that changed, in the order stored. */
export function changeWords(
  changes: AuditEventFacts["changes"],
  options: { timeZone: string; locale?: string },
): string {
  const t = translator(options.locale, "audit");
  return Object.entries(changes)
    .filter(([, { from, to }]) => JSON.stringify(from) !== JSON.stringify(to))
    .map(([field, { from, to }]) =>
      t("change", {
        field: fieldWord(t, field),
        from: valueWords(field, from, options),
        to: valueWords(field, to, options),
      }),
    )
    .join(", ");
}

/** The value an entry names: what it was before a removal, after an addition, or unchanged. */
function named(changes: AuditEventFacts["changes"], field: string): unknown {
  const entry = changes[field];
  if (!entry) return null;
  return entry.to ?? entry.from;
}

export function auditWords(
  event: AuditEventFacts,
  options: { timeZone: string; locale?: string },
): AuditEventWords {
  const locale = options.locale ?? "en-US";
  const opts = { timeZone: options.timeZone, locale };
  const t = translator(locale, "audit");
  const actor = event.actor ?? t("someone");
  const { action, changes } = event;
  const kind = action.startsWith("add")
    ? "add"
    : action.startsWith("edit") || action.startsWith("correct")
      ? "edit"
      : action.startsWith("delete")
        ? "delete"
        : action;
  const who =
    kind === "add"
      ? t("addedBy", { actor })
      : kind === "edit"
        ? t("correctedBy", { actor })
        : kind === "delete"
          ? t("removedBy", { actor })
          : t("by", { actor });
  const product = () => {
    const name = named(changes, "product");
    return typeof name === "string" ? name : t("anApplication");
  };
  const rate = () => valueWords("rate", named(changes, "rate"), opts);
  const depth = () => valueWords("depthIn", named(changes, "depthIn"), opts);
  const date = () => valueWords("wateredOn", named(changes, "wateredOn"), opts);
  const changed = () => changeWords(changes, opts) || t("checkUnchanged");

  let what: string;
  switch (event.entity) {
    case "visit":
      what =
        action === "finish"
          ? t("visitFinished")
          : action === "cancel"
            ? t("visitCanceled")
            : action === "rain_out"
              ? t("visitRainedOut")
              : action === "reschedule"
                ? t("visitRescheduled", {
                    from: valueWords("scheduledFor", changes.scheduledFor?.from, opts),
                    to: valueWords("scheduledFor", changes.scheduledFor?.to, opts),
                  })
                : action === "move" || action === "rain_delay"
                  ? t(action === "move" ? "visitMoved" : "visitRainDelayed", { changes: changed() })
                  : action === "reorder" || action === "driving_order"
                    ? t(action === "reorder" ? "visitReordered" : "visitRouted", {
                        changes: changed(),
                      })
                    : `${t("visitChanged")}${changeWords(changes, opts) ? `: ${changeWords(changes, opts)}` : ""}`;
      break;
    case "zone_check":
      what = kind === "add" ? t("checkAdded") : kind === "delete" ? t("checkRemoved") : changed();
      break;
    case "application":
      if (action === "override_legal_limit")
        what = t("overrideLegalLimit", {
          category: valueWords("category", named(changes, "category"), opts),
        });
      else if (action === "applied_at_differs")
        what = t("appliedAtDiffers", {
          from: valueWords("appliedAt", changes.appliedAt?.from, opts),
          to: valueWords("appliedAt", changes.appliedAt?.to, opts),
        });
      else if (kind === "add") what = t("applicationAdded", { product: product(), rate: rate() });
      else if (kind === "delete")
        what = t("applicationRemoved", { product: product(), rate: rate() });
      else what = t("applicationCorrected", { product: product(), changes: changed() });
      break;
    case "photo":
      what = kind === "delete" ? t("photoRemoved") : t("photoAdded");
      break;
    case "watering":
      what =
        kind === "add"
          ? t("wateringAdded", { depth: depth(), date: date() })
          : kind === "delete"
            ? t("wateringRemoved", { depth: depth(), date: date() })
            : t("wateringCorrected", { changes: changed() });
      break;
    default:
      what = changeWords(changes, opts) || t("visitChanged");
  }
  // An override's reason was kept among its changes before events had a reason of their own.
  const overrideReason = action === "override_legal_limit" ? named(changes, "reason") : null;
  const reason =
    event.reason?.trim() ||
    (typeof overrideReason === "string" ? overrideReason.trim() : "") ||
    null;
  let sentence: string;
  if (event.entity === "visit")
    sentence = reason
      ? t("visitLineWithReason", { what, who, reason })
      : t("visitLine", { what, who });
  else {
    const subject =
      event.zoneName ?? (event.entity === "watering" ? t("wholeProperty") : t("thisVisit"));
    sentence = reason
      ? t("lineWithReason", { subject, what, who, reason })
      : t("line", { subject, what, who });
  }
  return { when: formatDateTimeWithYear(event.at, options.timeZone, locale), sentence };
}
