// The manager's week on screen, in a company of its own: a technician's day is rained out and its
// stops appear on the next working day in the same order after that day's own stop; stops chosen
// and moved to another technician with the warning for a second visit that day confirmed on
// screen. At phone (390×844) and desktop (1440×900) size, with axe and screenshots.
import type { Kysely } from "kysely";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import type { Database } from "@/db/schema";
import { addDays, formatDate, todayIn } from "@/lib/dates";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const BASE = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let db: Kysely<Database>;
const today = todayIn("America/New_York");

beforeAll(async () => {
  useE2eDatabase();
  const { createTestCompany, testDb } = await import("../helpers/factories");
  db = testDb();
  c = await createTestCompany();
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

/** The first `weekday` (0 = Sunday) at least `ahead` days from today. */
function dayAhead(ahead: number, weekday: number): string {
  let d = addDays(today, ahead);
  while (new Date(`${d}T00:00:00Z`).getUTCDay() !== weekday) d = addDays(d, 1);
  return d;
}

async function stopAt(key: string, day: string, tech: "tech1" | "tech2", stopOrder: number) {
  const { scheduleVisit } = await import("@/lib/visits/mutations");
  return scheduleVisit(await c.actor("manager"), {
    propertyId: c.propertyIds[key]!,
    scheduledFor: day,
    technicianId: c.userIds[tech]!,
    plannedService: "inspection",
    stopOrder,
    notes: "",
    confirmSameDay: true,
  });
}

async function managerPage(viewport: typeof PHONE, path: string): Promise<Page> {
  const context = await browser.newContext({ viewport, baseURL: BASE });
  const cookie = await mintSessionCookie(c.userIds["manager"]!);
  await context.addCookies([
    { name: SESSION_COOKIE, value: cookie.split("=").slice(1).join("="), url: BASE },
  ]);
  const page = await context.newPage();
  const res = await page.goto(path);
  expect(res?.status(), path).toBe(200);
  return page;
}

const dayCell = (page: Page, tech: string, day: string) =>
  page.getByRole("listitem", { name: `${tech}, ${formatDate(day)}`, exact: true });

describe("the week's schedule", () => {
  for (const [size, viewport, weeksAhead] of [
    ["phone", PHONE, 5],
    ["desktop", DESKTOP, 7],
  ] as const) {
    it(`a rained-out Friday goes to Saturday in the same order (${size})`, async () => {
      const friday = dayAhead(weeksAhead * 7, 5);
      const saturday = addDays(friday, 1);
      const stops = [
        await stopAt("oyelaran", friday, "tech1", 1),
        await stopAt("haddad", friday, "tech1", 2),
        await stopAt("kowalczyk", friday, "tech1", 3),
      ];
      await stopAt("brandvold", saturday, "tech1", 1);
      const page = await managerPage(viewport, `/schedule?week=${friday}`);
      await page.getByRole("heading", { level: 1, name: "Week schedule" }).waitFor();
      const fri = dayCell(page, "Luis Arroyo", friday);
      await expect(fri.getByRole("img").getAttribute("aria-label")).resolves.toBe("3 of 10 stops");
      expect(await seriousViolations(page, "the week")).toEqual([]);
      await snap(page, `schedule-01-week-${size}`);

      await fri.getByRole("button", { name: "Rain delay" }).click();
      const preview = page.getByRole("region", { name: /^Rain delay: 3 stops to / });
      await preview.waitFor();
      await expect(preview.getByRole("listitem").allInnerTexts()).resolves.toEqual([
        `Oyelaran residence: stop 2 on ${formatDate(saturday)} (was ${formatDate(friday)})`,
        `Haddad residence: stop 3 on ${formatDate(saturday)} (was ${formatDate(friday)})`,
        `Kowalczyk residence: stop 4 on ${formatDate(saturday)} (was ${formatDate(friday)})`,
      ]);
      await snap(page, `schedule-02-rain-delay-preview-${size}`);
      await preview.getByRole("button", { name: "Move 3 stops" }).click();
      await page
        .getByRole("status")
        .filter({ hasText: `Moved 3 stops to ${formatDate(saturday)}.` })
        .waitFor();

      const sat = dayCell(page, "Luis Arroyo", saturday);
      await expect
        .poll(() => sat.getByRole("link").allInnerTexts())
        .toEqual([
          expect.stringMatching(/^1\. Brandvold residence/),
          expect.stringMatching(/^2\. Oyelaran residence/),
          expect.stringMatching(/^3\. Haddad residence/),
          expect.stringMatching(/^4\. Kowalczyk residence/),
        ]);
      await fri.getByText("No stops").waitFor();
      const rows = await db
        .selectFrom("visits")
        .select(["scheduled_for", "stop_order"])
        .where(
          "id",
          "in",
          stops.map((s) => s.id),
        )
        .orderBy("stop_order")
        .execute();
      expect(rows).toEqual([
        { scheduled_for: saturday, stop_order: 2 },
        { scheduled_for: saturday, stop_order: 3 },
        { scheduled_for: saturday, stop_order: 4 },
      ]);
      await snap(page, `schedule-03-after-${size}`);
      await page.context().close();
    });
  }

  it("moves a chosen stop to another technician once the warning is confirmed (phone)", async () => {
    const tuesday = dayAhead(63, 2);
    const wednesday = addDays(tuesday, 1);
    const moving = await stopAt("okafor", tuesday, "tech1", 1);
    await stopAt("okafor", wednesday, "tech2", 1);
    const page = await managerPage(PHONE, `/schedule?week=${tuesday}`);
    await dayCell(page, "Luis Arroyo", tuesday)
      .getByRole("checkbox", { name: `Choose Okafor residence on ${formatDate(tuesday)}` })
      .check();
    const bar = page.getByRole("form", { name: "Move the chosen stops" });
    await bar.getByText("1 stop chosen").waitFor();
    await bar.getByLabel("Move to").fill(wednesday);
    await bar.getByLabel("Technician").selectOption({ label: "Priya Nandakumar" });
    await bar.getByRole("button", { name: "Preview the move" }).click();
    const preview = page.getByRole("region", { name: /^Move: 1 stop to / });
    await preview
      .getByText(`Okafor residence already has a visit on ${formatDate(wednesday)}.`)
      .waitFor();
    expect(await seriousViolations(page, "the move's preview")).toEqual([]);
    await snap(page, "schedule-04-move-warning-phone");
    await preview.getByRole("button", { name: "Move 1 stop anyway" }).click();
    await page.getByRole("status").filter({ hasText: "Moved 1 stop" }).waitFor();
    const row = await db
      .selectFrom("visits")
      .select(["scheduled_for", "technician_id", "stop_order"])
      .where("id", "=", moving.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({
      scheduled_for: wednesday,
      technician_id: c.userIds["tech2"],
      stop_order: 2,
    });
    await page.context().close();
  });
});
