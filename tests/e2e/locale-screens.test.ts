// US English and US dates on the screens people read most, at a phone's and a desktop's size:
// the manager's book, a finished visit's summary and the homeowner's lawn page. Dates read the US
// way ("Wed, Dec 2, 2026": month before day, CLDR en-US), never "2 Dec 2026" or "02/12/2026"; the
// homeowner's headline never pairs "holding steady" with a change of many points. Screenshots go
// to tests/.artifacts/screenshots/<SHOTS_PREFIX>-… to look at (before/after comparisons).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import { snap } from "../helpers/screenshots";

const BASE = inject("baseUrl");
const PREFIX = process.env.SHOTS_PREFIX ?? "locale";
const SIZES = { phone: { width: 390, height: 844 }, desktop: { width: 1440, height: 900 } };
const BRITISH_DATE = /\b\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec)\b/;
const US_DATE = /\b(Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{1,2}, \d{4}\b/;

let browser: Browser;
const cookie: Record<string, string> = {};
let visitId = "";

beforeAll(async () => {
  useE2eDatabase();
  const { testDb } = await import("../helpers/factories");
  const db = testDb();
  const id = async (email: string) =>
    (await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow())
      .id;
  cookie.manager = await mintSessionCookie(await id("manager@demo.sward.test"));
  cookie.owner = await mintSessionCookie(await id("owner2@demo.sward.test"));
  const visit = await db
    .selectFrom("visits")
    .innerJoin("property_homeowners", "property_homeowners.property_id", "visits.property_id")
    .innerJoin("users", "users.id", "property_homeowners.user_id")
    .select("visits.id")
    .where("users.email", "=", "owner2@demo.sward.test")
    .where("visits.status", "=", "completed")
    .orderBy("visits.scheduled_for", "desc")
    .executeTakeFirstOrThrow();
  visitId = visit.id;
  browser = await launchBrowser();
}, 60_000);

afterAll(async () => {
  await browser?.close();
});

async function open(who: string, size: keyof typeof SIZES, path: string): Promise<Page> {
  const context = await browser.newContext({ viewport: SIZES[size] });
  await context.addCookies([
    { name: SESSION_COOKIE, value: cookie[who]!.split("=").slice(1).join("="), url: BASE },
  ]);
  const page = await context.newPage();
  const res = await page.goto(`${BASE}${path}`, { waitUntil: "networkidle" });
  expect(res?.status(), path).toBe(200);
  return page;
}

const SCREENS = [
  { name: "book", who: "manager", path: () => "/book" },
  { name: "visit-summary", who: "manager", path: () => `/visits/${visitId}` },
  { name: "my-lawn", who: "owner", path: () => "/my-lawn" },
] as const;

describe("locale on screens", () => {
  for (const screen of SCREENS)
    for (const size of ["phone", "desktop"] as const)
      it(`${screen.name} at ${SIZES[size].width}×${SIZES[size].height} reads US dates`, async () => {
        const page = await open(screen.who, size, screen.path());
        await snap(page, `${PREFIX}-${screen.name}-${size}`, true);
        const text = await page.evaluate(() => document.body.innerText);
        expect(text.match(BRITISH_DATE)?.[0] ?? null).toBeNull();
        if (screen.name !== "book") expect(text).toMatch(US_DATE);
        expect(await page.evaluate(() => document.documentElement.lang)).toBe("en-US");
        if (screen.name === "my-lawn") {
          // One sentence from the trend and the change: never "steady" beside a big move.
          expect(text).not.toMatch(/holding steady\.[^.]*\b(Up|Down) (1[0-9]|[2-9]\d) points/);
          expect(text).not.toMatch(/\(n \d+\)|r²|DGCI/);
        }
        await page.context().close();
      });
});
