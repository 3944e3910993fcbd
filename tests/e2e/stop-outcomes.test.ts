// The technician's side of a stop, on a phone (390×844): a stop rained out from Today with a
// reason (refused without one) and rescheduled on the day offered; the zone form showing the zone's
// last check (date, who, ratings, height of cut) beside today's ratings; and the rating area
// measured with bounding boxes — the screen left between the top and the sticky save bar or the
// bottom navigation, whichever is higher, is at least 70 % of the 844 px. Screenshots go to
// tests/.artifacts/screenshots.
import type { Kysely } from "kysely";
import type { Browser, BrowserContext } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import type { Database } from "@/db/schema";

import { seriousViolations } from "../helpers/axe";
import { launchBrowser, PHONE } from "../helpers/browser";
import { mintSessionCookie, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let today: string;
let db: Kysely<Database>;

beforeAll(async () => {
  useE2eDatabase();
  const [{ createTestCompany, testDb }, { todayIn }] = await Promise.all([
    import("../helpers/factories"),
    import("@/lib/dates"),
  ]);
  browser = await launchBrowser();
  c = await createTestCompany();
  db = testDb();
  today = todayIn("America/New_York"); // the demo company's time zone
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

/** A phone signed in as the company's first technician (a session minted as sign-in does). */
async function phoneAs(personKey: string): Promise<BrowserContext> {
  const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
  const cookie = await mintSessionCookie(c.userIds[personKey]!);
  const [name, value] = cookie.split(/=(.*)/s) as [string, string];
  await context.addCookies([{ name, value, url: baseUrl }]);
  return context;
}

describe("a stop called off from Today on a phone", () => {
  it("needs a reason, shows the outcome with the kept checks and the next free day, and reschedules", async () => {
    const [{ scheduleVisit }, { addDays, formatDate }] = await Promise.all([
      import("@/lib/visits/mutations"),
      import("@/lib/dates"),
    ]);
    const manager = await c.actor("manager");
    const propertyId = c.propertyIds["haddad"]!;
    const visit = await scheduleVisit(manager, {
      propertyId,
      scheduledFor: today,
      technicianId: c.userIds["tech1"]!,
      plannedService: "inspection",
      stopOrder: 90,
      notes: "",
      confirmSameDay: true,
    });
    // The day to be offered, worked out here: after today, not a Sunday, no other visit there.
    const taken = new Set(
      (
        await db
          .selectFrom("visits")
          .select("scheduled_for")
          .where("property_id", "=", propertyId)
          .where("status", "!=", "cancelled")
          .where("id", "!=", visit.id)
          .execute()
      ).map((v) => v.scheduled_for),
    );
    let expected = addDays(today, 1);
    while (taken.has(expected) || new Date(`${expected}T00:00:00Z`).getUTCDay() === 0)
      expected = addDays(expected, 1);

    const context = await phoneAs("tech1");
    const page = await context.newPage();
    await page.goto("/today");
    const stop = page.locator("li", { has: page.locator(`a[href="/visits/${visit.id}"]`) });
    await stop.getByRole("button", { name: "Rained out or canceled" }).click();
    const form = stop.getByRole("form", { name: /Call off the stop/ });
    await form.getByRole("radio", { name: "Rained out" }).check();
    await form.getByRole("button", { name: "Mark rained out" }).click();
    await expect(form.getByRole("alert").innerText()).resolves.toBe(
      "Reason: say why the stop did not happen (at least 3 characters).",
    );
    expect(
      (await db.selectFrom("visits").select("status").where("id", "=", visit.id).executeTakeFirst())
        ?.status,
    ).toBe("scheduled");
    await snap(page, "stop-outcomes-01-reason-required");

    const reason = "Thunderstorm since 10 AM, turf saturated";
    await form.getByLabel("Reason (required)").fill(reason);
    await form.getByRole("button", { name: "Mark rained out" }).click();
    await stop.getByText(`Rained out: ${reason}`).waitFor();
    await stop.getByText(`Next free day: ${formatDate(expected)}`).waitFor();
    await stop.getByText("Rained out", { exact: true }).waitFor(); // the badge
    await snap(page, "stop-outcomes-02-rained-out");
    expect(await seriousViolations(page, "today with a rained-out stop")).toEqual([]);

    const row = await db
      .selectFrom("visits")
      .select(["status", "cancel_kind", "cancel_reason", "cancelled_by"])
      .where("id", "=", visit.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({
      status: "cancelled",
      cancel_kind: "rained_out",
      cancel_reason: reason,
      cancelled_by: c.userIds["tech1"],
    });
    const audit = await db
      .selectFrom("audit_events")
      .select("action")
      .where("entity_id", "=", visit.id)
      .execute();
    expect(audit.map((a) => a.action)).toEqual(["rain_out"]);

    await stop.getByRole("button", { name: `Reschedule for ${formatDate(expected)}` }).click();
    await stop.getByText(/Rescheduled for/).waitFor();
    const replacement = await db
      .selectFrom("visits as old")
      .innerJoin("visits as next", "next.id", "old.rescheduled_visit_id")
      .select(["next.scheduled_for", "next.technician_id", "next.status"])
      .where("old.id", "=", visit.id)
      .executeTakeFirstOrThrow();
    expect(replacement).toEqual({
      scheduled_for: expected,
      technician_id: c.userIds["tech1"],
      status: "scheduled",
    });
    await snap(page, "stop-outcomes-03-rescheduled");
    await context.close();

    // The manager reads both events in the called-off visit's audit trail, in words.
    const office = await phoneAs("manager");
    const managerPage = await office.newPage();
    await managerPage.goto(`/visits/${visit.id}`);
    const trail = managerPage.getByRole("list", { name: "Audit trail" });
    await trail.getByText(`Stop rained out — by Luis Arroyo: ${reason}`).waitFor();
    await trail.getByText(/^Visit rescheduled from .+ to .+ — by Luis Arroyo$/).waitFor();
    expect(await seriousViolations(managerPage, "a rained-out visit's audit trail")).toEqual([]);
    await snap(managerPage, "stop-outcomes-04-audit-trail");
    await office.close();
  });
});

describe("the zone form on a phone", () => {
  it("shows the zone's last check beside today's ratings, and keeps the rating area ≥ 70 % of the screen", async () => {
    const { formatNumericDate } = await import("@/lib/dates");
    // One of tech1's stops today at a property with a finished visit before (the demo's history).
    const stops = await db
      .selectFrom("visits")
      .select(["id", "property_id"])
      .where("company_id", "=", c.companyId)
      .where("technician_id", "=", c.userIds["tech1"]!)
      .where("scheduled_for", "=", today)
      .where("status", "=", "scheduled")
      .orderBy("stop_order")
      .execute();
    let found: { visitId: string; zoneId: string; zoneName: string } | null = null;
    for (const s of stops) {
      const zone = await db
        .selectFrom("zones")
        .select(["id", "name"])
        .where("property_id", "=", s.property_id)
        .where("archived_at", "is", null)
        .orderBy("sort_order")
        .orderBy("name")
        .executeTakeFirst();
      const last = zone
        ? await db
            .selectFrom("zone_checks")
            .innerJoin("visits", "visits.id", "zone_checks.visit_id")
            .select("zone_checks.id")
            .where("zone_checks.zone_id", "=", zone.id)
            .where("visits.status", "=", "completed")
            .where("zone_checks.status", "=", "done")
            .executeTakeFirst()
        : undefined;
      if (zone && last) {
        found = { visitId: s.id, zoneId: zone.id, zoneName: zone.name };
        break;
      }
    }
    expect(found, "a stop today whose first zone was checked before").not.toBeNull();
    const { visitId, zoneId, zoneName } = found!;
    // The last check, read here from the tables: the newest finished visit's check of the zone.
    const last = await db
      .selectFrom("zone_checks")
      .innerJoin("visits", "visits.id", "zone_checks.visit_id")
      .leftJoin("users as checker", "checker.id", "zone_checks.updated_by")
      .leftJoin("users as tech", "tech.id", "visits.technician_id")
      .select([
        "zone_checks.status",
        "zone_checks.quality",
        "zone_checks.color",
        "zone_checks.height_of_cut_in",
        "visits.scheduled_for",
        "checker.name as checker",
        "tech.name as technician",
      ])
      .where("zone_checks.zone_id", "=", zoneId)
      .where("visits.status", "=", "completed")
      .where("zone_checks.status", "in", ["done", "skipped"])
      .where("visits.scheduled_for", "<=", today)
      .orderBy("visits.scheduled_for", "desc")
      .orderBy("visits.completed_at", "desc")
      .executeTakeFirstOrThrow();

    const context = await phoneAs("tech1");
    const page = await context.newPage();
    await page.goto(`/visits/${visitId}`);
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.waitForURL(/zone=/);
    await page.getByRole("heading", { level: 1, name: zoneName }).waitFor();

    const who = last.checker ?? last.technician;
    const summary = page.locator("[data-last-check] summary");
    await expect(summary.innerText()).resolves.toContain(
      `Last check ${formatNumericDate(last.scheduled_for)}${who ? ` · ${who}` : ""}`,
    );
    if (last.status === "done") {
      await page.getByText(`last check: ${last.quality}`).first().waitFor();
      expect(
        await page
          .locator("fieldset", { has: page.getByText("Overall quality", { exact: true }) })
          .first()
          .innerText(),
      ).toContain(`last check: ${last.quality}`);
    }

    // The rating area, with the last check folded (as the page opens): Ratings at the top of the
    // screen, measured up to the higher of the save bar and the bottom navigation.
    await page
      .getByRole("heading", { name: "Ratings" })
      .evaluate((h) => h.closest("section")!.scrollIntoView({ block: "start" }));
    await page.waitForTimeout(200);
    const bar = (await page.locator("[data-save-bar]").boundingBox())!;
    const nav = (await page.locator("nav[aria-label='Main']").last().boundingBox())!;
    const ratingArea = Math.min(bar.y, nav.y);
    const share = ratingArea / PHONE.height;
    console.info(
      `rating area at 390×844: ${Math.round(ratingArea)} of ${PHONE.height} px (${(share * 100).toFixed(1)} %); save bar ${Math.round(bar.height)} px, bottom navigation ${Math.round(nav.height)} px, both together ${Math.round(PHONE.height - ratingArea)} px`,
    );
    expect(share).toBeGreaterThanOrEqual(0.7);
    // The first rating's two rows of buttons are on screen above the bar with the summary folded.
    const firstRating = page.getByRole("radiogroup", {
      name: "Overall quality, acceptable",
      exact: true,
    });
    const ratingBox = (await firstRating.boundingBox())!;
    expect(ratingBox.y).toBeGreaterThanOrEqual(0);
    expect(ratingBox.y + ratingBox.height).toBeLessThanOrEqual(ratingArea);
    await snap(page, "stop-outcomes-04-zone-form-phone");

    // Opened, the last check shows its ratings and height of cut.
    await summary.click();
    const details = page.locator("[data-last-check]");
    if (last.status === "done") {
      await expect(details.innerText()).resolves.toContain(
        last.height_of_cut_in === null
          ? "not measured"
          : `${Number(last.height_of_cut_in).toFixed(2)} in`,
      );
      await expect(details.innerText()).resolves.toContain(`${last.color} of 9`);
    }
    await snap(page, "stop-outcomes-05-last-check-open");
    expect(await seriousViolations(page, "zone form with the last check")).toEqual([]);
    await context.close();
  });
});
