// The offline field app's figures for `npm run bench` (tests/bench/run.ts): the storage a day of
// stops takes on the phone once Today has saved it (navigator.storage.estimate(): caches and
// IndexedDB of the origin, app shell included), and the time a visit page takes to open (its
// Navigation Timing entry: shown at DOMContentLoaded, done at load) with no network and the CPU slowed four times (Chromium's CDP
// Emulation.setCPUThrottlingRate, a mid-range phone profile as Lighthouse uses it). Printed
// figures, not assertions.
import type { Browser } from "playwright-core";

export interface OfflineFigures {
  stops: number;
  /** Today's status once the save ended ("Ready offline — 5 stops, saved …" or what it missed). */
  status: string;
  /** Tap on Today → the save's status settled (the day saved, or what it could not keep). */
  saveMs: number;
  storageMb: number;
  /** Navigation start → DOMContentLoaded (the server-rendered visit shown), per run. */
  openMs: number[];
  /** Navigation start → load (every script run), per run. */
  loadMs: number[];
}

/** Today's offline status once the save ended (components/pwa/offline-ready.tsx). */
const SETTLED = '[data-offline-status]:not([data-offline-status="working"])';

export async function measureOffline(
  browser: Browser,
  base: string,
  cookie: string,
  runs = 3,
): Promise<OfflineFigures> {
  const context = await browser.newContext({
    viewport: { width: 390, height: 844 },
    serviceWorkers: "allow",
  });
  try {
    await context.addCookies(
      cookie.split("; ").map((c) => ({
        name: c.split("=")[0]!,
        value: c.slice(c.indexOf("=") + 1),
        url: base,
      })),
    );
    const page = await context.newPage();
    const t0 = Date.now();
    await page.goto(`${base}/today`);
    const settled = page.locator(SETTLED);
    await settled.waitFor({ timeout: 180_000 });
    const saveMs = Date.now() - t0;
    const status = (await settled.locator("p").textContent())?.trim() ?? "";
    const stopLinks = page.getByRole("list", { name: "Stops" }).getByRole("link");
    const stops = await stopLinks.count();
    const href = await stopLinks.first().getAttribute("href");
    if (!href) throw new Error("bench: the technician has no stop today");
    const usage = await page.evaluate(async () => (await navigator.storage.estimate()).usage ?? 0);

    await context.setOffline(true);
    const cdp = await context.newCDPSession(page);
    await cdp.send("Emulation.setCPUThrottlingRate", { rate: 4 });
    const openMs: number[] = [];
    const loadMs: number[] = [];
    for (let i = 0; i < runs; i += 1) {
      await page.goto(`${base}/today`);
      await page.getByRole("heading", { level: 1, name: "Today" }).waitFor();
      await page.goto(`${base}${href}`, { waitUntil: "load" });
      await page.getByRole("list", { name: "Zones of this visit" }).waitFor();
      // From the tap (navigation start): the page's content parsed and shown / every script run.
      const nav = await page.evaluate(() => {
        const e = performance.getEntriesByType("navigation")[0] as PerformanceNavigationTiming;
        return { shown: e.domContentLoadedEventEnd, loaded: e.loadEventEnd };
      });
      openMs.push(nav.shown);
      loadMs.push(nav.loaded);
    }
    await cdp.send("Emulation.setCPUThrottlingRate", { rate: 1 });
    return { stops, status, saveMs, storageMb: usage / 1024 / 1024, openMs, loadMs };
  } finally {
    await context.close();
  }
}
