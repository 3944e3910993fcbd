// Pressure-area reads for managers (the whole book is their scope; technicians and homeowners
// see none, since an area is drawn from properties outside their own).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { todayIn } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";
import { alertKindLabel } from "@/lib/risk/labels";
import { isInsideArea, pressureSince } from "@/lib/risk/pressure-areas";

import type { PressureAreasView, PressureSettingsDto } from "./dto";
import {
  checkSoonIds,
  needsCheck,
  readAreaClusters,
  readPressureAreas,
  readPressureSettings,
} from "./read";

const managersOnly = (actor: Actor) => {
  if (actor.role !== "manager") throw new AppError("forbidden", "Pressure areas are for managers.");
};

export async function getPressureSettings(actor: Actor): Promise<PressureSettingsDto> {
  managersOnly(actor);
  return readPressureSettings(db(), actor.companyId);
}

/** The company's pressure areas today, with their properties, alerts and evidence. */
export async function listPressureAreas(actor: Actor): Promise<PressureAreasView> {
  managersOnly(actor);
  const today = todayIn(actor.companyTimeZone);
  const settings = await readPressureSettings(db(), actor.companyId);
  return {
    today,
    since: pressureSince(today),
    settings,
    areas: await readPressureAreas(db(), actor.companyId, today, settings),
  };
}

/**
 * Which of these places (book rows, map points, one property) to flag "Check soon". Managers only;
 * for anyone else, none.
 */
export async function findCheckSoon(
  actor: Actor,
  places: { id: string; lat: number; lng: number; lastVisitOn: string | null }[],
): Promise<Set<string>> {
  if (actor.role !== "manager" || !places.length) return new Set();
  const today = todayIn(actor.companyTimeZone);
  const settings = await readPressureSettings(db(), actor.companyId);
  const areas = await readAreaClusters(db(), actor.companyId, today, settings);
  return checkSoonIds(areas, settings, today, places);
}

/**
 * The pressure area a property lies in when it should be checked soon (managers; null for anyone
 * else, for a property outside every area, or one visited within the window).
 */
export async function findPropertyCheckSoon(
  actor: Actor,
  propertyId: string,
): Promise<{ kindLabel: string; firstOn: string; latestOn: string; days: number } | null> {
  if (actor.role !== "manager") return null;
  const property = await db()
    .selectFrom("properties")
    .leftJoin("property_summaries as ps", "ps.property_id", "properties.id")
    .select(["properties.latitude", "properties.longitude", "ps.last_visit_on"])
    .where("properties.id", "=", propertyId)
    .where(propertyInScope(actor))
    .where("properties.archived_at", "is", null)
    .executeTakeFirst();
  if (!property) return null;
  const today = todayIn(actor.companyTimeZone);
  const settings = await readPressureSettings(db(), actor.companyId);
  if (!needsCheck(property.last_visit_on ?? null, today, settings)) return null;
  const areas = await readAreaClusters(db(), actor.companyId, today, settings);
  const place = { lat: property.latitude, lng: property.longitude };
  const area = areas.find((a) => isInsideArea(a, settings, place));
  return area
    ? {
        kindLabel: alertKindLabel(area.kind),
        firstOn: area.firstOn,
        latestOn: area.latestOn,
        days: settings.days,
      }
    : null;
}
