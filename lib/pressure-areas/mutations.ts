// The company's pressure-area settings (managers). The areas are computed on read, so a changed
// setting shows on the next read of the Alerts page, the map and the book.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";

import type { PressureSettingsDto } from "./dto";
import type { PressureSettingsInput } from "./schemas";

export async function savePressureSettings(
  actor: Actor,
  input: PressureSettingsInput,
): Promise<PressureSettingsDto> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the pressure-area settings.");
  const row = await db()
    .updateTable("companies")
    .set({
      pressure_distance_mi: input.distanceMi,
      pressure_days: input.days,
      pressure_min_properties: input.minProperties,
    })
    .where("id", "=", actor.companyId)
    .returning(["pressure_distance_mi", "pressure_days", "pressure_min_properties"])
    .executeTakeFirst();
  if (!row) throw notFound("Company settings");
  return {
    distanceMi: Number(row.pressure_distance_mi),
    days: Number(row.pressure_days),
    minProperties: Number(row.pressure_min_properties),
  };
}
