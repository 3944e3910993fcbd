// What one tap on a zone check's stepper costs on a phone (390×844), on a company of the test's own
// (its technician's day is not the demo's): a tap keeps the draft on the phone and no more; the
// change becomes one operation in the outbox (lib/offline) only after the autosave's pause, so a
// run of quick taps writes the outbox a few times, not once per tap, and "Saved" still comes
// promptly. The figures (each tap's time, the outbox writes, the main thread's long tasks) go to
// tests/.artifacts/zone-check-taps.json and the log.
import { mkdirSync, writeFileSync } from "node:fs";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser, PHONE } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";

const baseUrl = inject("baseUrl");
const TAPS = 20;
let browser: Browser;
let c: TestCompany;
let visitId: string;

beforeAll(async () => {
  browser = await launchBrowser();
  useE2eDatabase();
  const { createTestCompany } = await import("../helpers/factories");
  const { scheduleVisit } = await import("@/lib/visits/mutations");
  const { todayIn } = await import("@/lib/dates");
  c = await createTestCompany();
  const manager = await c.actor("manager");
  const visit = await scheduleVisit(manager, {
    propertyId: Object.values(c.propertyIds)[0]!,
    scheduledFor: todayIn(manager.companyTimeZone),
    technicianId: c.userIds["tech1"]!,
    plannedService: "inspection",
    stopOrder: 1,
    notes: "",
    confirmSameDay: true,
  });
  visitId = visit.id;
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

/** Counts this page's writes to the outbox's IndexedDB table (`ops`) and the long tasks. */
function countOutboxWrites() {
  const w = window as unknown as { __opsWrites: number; __longTasks: number[] };
  w.__opsWrites = 0;
  w.__longTasks = [];
  const proto = IDBObjectStore.prototype;
  for (const name of ["add", "put", "delete", "clear"] as const) {
    const original = proto[name] as (...args: unknown[]) => IDBRequest;
    (proto as unknown as Record<string, unknown>)[name] = function (
      this: IDBObjectStore,
      ...args: unknown[]
    ) {
      if (this.name === "ops") w.__opsWrites += 1;
      return original.apply(this, args);
    };
  }
  try {
    new PerformanceObserver((list) => {
      for (const entry of list.getEntries()) w.__longTasks.push(entry.duration);
    }).observe({ type: "longtask" });
  } catch {
    /* no long-task timing in this browser */
  }
}

const counters = (page: Page) =>
  page.evaluate(() => {
    const w = window as unknown as { __opsWrites: number; __longTasks: number[] };
    return { opsWrites: w.__opsWrites, longTasks: [...w.__longTasks] };
  });

const quantile = (sorted: number[], q: number) =>
  sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))]!;

describe("a tap on a zone check", () => {
  it(`${TAPS} quick taps write the draft each time and the outbox only after the pause; Saved follows`, async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const cookie = await mintSessionCookie(c.userIds["tech1"]!);
    await context.addCookies([
      { name: SESSION_COOKIE, value: cookie.split("=").slice(1).join("="), url: baseUrl },
    ]);
    await context.addInitScript(countOutboxWrites);
    const page = await context.newPage();
    await page.goto(`/visits/${visitId}`);
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.waitForURL(/zone=/);
    const more = page.getByRole("button", { name: "Height of cut: more" });
    const less = page.getByRole("button", { name: "Height of cut: less" });
    await more.scrollIntoViewIfNeeded();
    await expect.poll(() => more.isEnabled(), { timeout: 10_000 }).toBe(true);
    // Everything the start wrote has settled before the taps are counted.
    await page.waitForTimeout(1_500);
    const before = await counters(page);

    // Taps as a person makes them: up ten times, back down ten times (3.00 in, up to 5.25, down to 2.75).
    const times: number[] = [];
    const started = Date.now();
    for (let i = 0; i < TAPS; i++) {
      const t0 = performance.now();
      await (i < TAPS / 2 ? more : less).click();
      times.push(performance.now() - t0);
    }
    const burstMs = Date.now() - started;
    const during = await counters(page);
    await page
      .getByRole("status")
      .filter({ hasText: /^Saved/ })
      .waitFor({ timeout: 10_000 });
    const savedAfterMs = Date.now() - started - burstMs;
    const after = await counters(page);

    const sorted = [...times].sort((a, b) => a - b);
    const figures = {
      taps: TAPS,
      tapMedianMs: Math.round(quantile(sorted, 0.5)),
      tapP90Ms: Math.round(quantile(sorted, 0.9)),
      burstMs,
      savedAfterLastTapMs: savedAfterMs,
      outboxWritesDuringTaps: during.opsWrites - before.opsWrites,
      outboxWritesUntilSaved: after.opsWrites - before.opsWrites,
      longTasksDuringTaps: during.longTasks.length - before.longTasks.length,
      longTaskMsDuringTaps: Math.round(
        during.longTasks.slice(before.longTasks.length).reduce((a, b) => a + b, 0),
      ),
    };
    mkdirSync("tests/.artifacts", { recursive: true });
    writeFileSync("tests/.artifacts/zone-check-taps.json", `${JSON.stringify(figures, null, 2)}\n`);
    console.log("zone-check taps:", JSON.stringify(figures));

    // One tap, one draft: the outbox is written after the pause (a save: the operation, its
    // claim, its removal), never once per tap. A slow machine may let one pause pass mid-run.
    expect(figures.outboxWritesDuringTaps).toBeLessThan(TAPS / 2);
    expect(figures.outboxWritesUntilSaved).toBeLessThan(TAPS / 2);

    // What the server holds is the last tap's value, and nothing waits on the phone.
    const saved = (await (await page.request.get(`/api/v1/visits/${visitId}`)).json()) as {
      checks: { heightOfCutIn: number | null }[];
    };
    expect(saved.checks[0]?.heightOfCutIn).toBe(2.75);
    const waiting = await page.evaluate(
      () =>
        new Promise<number>((resolve, reject) => {
          const open = indexedDB.open("sward-offline");
          open.onerror = () => reject(open.error);
          open.onsuccess = () => {
            const count = open.result.transaction("ops").objectStore("ops").count();
            count.onsuccess = () => resolve(count.result);
            count.onerror = () => reject(count.error);
          };
        }),
    );
    expect(waiting).toBe(0);
    await context.close();
  }, 90_000);
});
