// Keeps a visit's weather snapshot filled (the "next sync" after an unavailable service).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";

import { weatherSnapshot } from "./queries";

/** Fills a visit's snapshot when it is missing or was unavailable (the "next sync"). */
export async function fillVisitWeather(actor: Actor, visitId: string): Promise<void> {
  const visit = await db()
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select([
      "visits.id",
      "visits.weather",
      "visits.scheduled_for",
      "visits.status",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
    ])
    .where("visits.company_id", "=", actor.companyId)
    .where("visits.id", "=", visitId)
    .executeTakeFirst();
  if (
    !visit ||
    visit.status === "scheduled" ||
    (visit.weather as { status?: string } | null)?.status === "ok"
  )
    return;
  const snapshot = await weatherSnapshot(
    visit.latitude,
    visit.longitude,
    visit.scheduled_for,
    todayIn(visit.time_zone),
  );
  if (snapshot.status === "ok" || !visit.weather)
    await db()
      .updateTable("visits")
      .set({ weather: JSON.stringify(snapshot) })
      .where("id", "=", visitId)
      .execute();
}
