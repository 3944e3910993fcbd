// The demo works on any day of the year. For one date in each season (and 2 December, the first
// day of New Jersey's professional no-fertilizer window), the demo is seeded for that date
// (`seed.ts --date`) into a database of its own, and the clocks of PostgreSQL, the seed, the fake
// weather service, the web server (libfaketime, tests/harness/faketime.ts) and the browser
// (Playwright's clock) are set to that day. tech1 then opens Today, sees the round of the season
// (lib/agronomy/season.ts), starts the first stop, rates every zone, records the application the
// round's office note calls for (when it calls for one) and finishes the visit.
//
// Light on CPU: one cluster, migrated once, restarted for each date with its shifted clock; one
// browser; the dates run one after another; the seed leaves out the generated photos.
import { spawnSync } from "node:child_process";
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";

import { crashCluster, isListening, stopCluster, type Cluster } from "../crash/postgres";
import { ensureFaketime, shiftedClock } from "../harness/faketime";
import { startSmtpFake } from "../harness/smtp-fake";
import { Supervisor } from "../harness/supervisor";
import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { TSX, waitForUrl } from "../helpers/processes";
import { snap } from "../helpers/screenshots";

const E2E_PORT = Number(process.env.SWARD_E2E_PORT ?? 3100);
const PORT = E2E_PORT + 2; // the suite's own server (E2E_PORT + 1 is the shared weather fake)
const WEATHER_PORT = E2E_PORT + 3;
const PG_PORT = String(
  process.env.SWARD_SEASONS_PG_PORT ?? Number(process.env.SWARD_PG_PORT ?? 54329) + 20,
);
const DATABASE = "sward_seasons";
const AUTH_SECRET = "e2e-seasons-only-secret-0123456789abcdefghij";
const MAIL_DIR = path.resolve("tests/.artifacts/mail-seasons");
const baseUrl = `http://localhost:${PORT}`;

/** The round expected on each date at tech1's first stop (Oyelaran residence, central New Jersey). */
const DATES: { date: string; service: keyof typeof PLANNED_SERVICES }[] = [
  { date: "2026-01-15", service: "inspection" },
  { date: "2026-04-20", service: "feeding_round" },
  { date: "2026-07-15", service: "insect_control" },
  { date: "2026-10-10", service: "fall_feeding" },
  // N.J.S.A. 58:10A-62b: no professional application of fertilizer containing nitrogen or
  // phosphorus "before March 1st or after December 1st": lime, which carries neither.
  { date: "2026-12-02", service: "liming" },
];

let browser: Browser;
let cluster: Cluster;
let library = "";
const top = new Supervisor("seasons e2e", false);
let smtp: Awaited<ReturnType<typeof startSmtpFake>> | undefined;

function clusterSh(command: "start" | "stop", env: Record<string, string>): void {
  const r = spawnSync("sh", ["db/cluster.sh", command], {
    env: { ...process.env, ...cluster.env, ...env },
    encoding: "utf8",
  });
  if (r.status !== 0) throw new Error(`db/cluster.sh ${command}: ${r.stderr}${r.stdout}`);
}

beforeAll(async () => {
  library = ensureFaketime();
  cluster = crashCluster(PG_PORT, "tests/.artifacts/seasons-pg");
  await stopCluster(cluster);
  if (await isListening(Number(PG_PORT)))
    throw new Error(
      `seasons: port ${PG_PORT} is taken by a server this suite did not start; set SWARD_SEASONS_PG_PORT`,
    );
  top.defer("stop the seasons PostgreSQL", () => stopCluster(cluster), {
    argv: ["sh", "db/cluster.sh", "stop"],
    env: cluster.env,
  });
  clusterSh("start", {});
  const env = { ...cluster.env, DATABASE_URL: cluster.url(DATABASE) };
  await top.step("database", TSX, ["db/ensure-database.ts", DATABASE, "--fresh"], { env });
  await top.step("migrate", TSX, ["db/migrate.ts"], { env });
  smtp = await startSmtpFake(0, MAIL_DIR);
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
  await smtp?.close();
  await top.stop();
}, 60_000);

async function rate(page: Page, label: string, value: number) {
  const group = value >= 6 ? `${label}, acceptable` : `${label}, below acceptable`;
  await page
    .getByRole("radiogroup", { name: group, exact: true })
    .getByRole("radio", { name: String(value), exact: true })
    .click();
}

async function waitSaved(page: Page) {
  await page
    .getByRole("status")
    .filter({ hasText: /^Saved/ })
    .waitFor({ timeout: 15_000 });
}

describe("the demo on any day: tech1 completes the round of the season", () => {
  for (const { date, service } of DATES) {
    it(`${date}: ${PLANNED_SERVICES[service]}`, async () => {
      // The shifted clock reads 10 a.m. in New Jersey (15:00 UTC) on the date when the run starts.
      const target = Date.parse(`${date}T15:00:00Z`);
      const clock = shiftedClock(library, (target - Date.now()) / 1000);
      const sup = new Supervisor(`seasons ${date}`, false);
      try {
        await stopCluster(cluster);
        clusterSh("start", clock);
        const env = { ...clock, ...cluster.env, DATABASE_URL: cluster.url(DATABASE) };
        const seeded = await sup.step(
          "seed",
          TSX,
          ["fixtures/demo/seed.ts", "--reset", "--date", date, "--no-photos"],
          { env, capture: true },
        );
        expect(seeded).toContain(`Larkmoor Lawn Care on ${date}`);
        sup.start("weather fake", TSX, ["tests/harness/weather-fake.ts", String(WEATHER_PORT)], {
          env: clock,
          stdio: ["ignore", "ignore", "inherit"],
        });
        sup.start(
          "server",
          "node",
          [
            "--import",
            "./lib/http/edge-address.mjs",
            "node_modules/next/dist/bin/next",
            "start",
            "-H",
            "127.0.0.1",
            "-p",
            String(PORT),
          ],
          {
            stdio: ["ignore", "ignore", "inherit"],
            env: {
              ...env,
              NODE_ENV: "production",
              NEXT_TELEMETRY_DISABLED: "1",
              AUTH_SECRET,
              AUTH_URL: baseUrl,
              LOG_LEVEL: "warn",
              PHOTO_DIR: "tests/.artifacts/photos-seasons",
              WEATHER_BASE_URL: `http://127.0.0.1:${WEATHER_PORT}`,
              SMTP_URL: `smtp://127.0.0.1:${smtp!.port}`,
              MAIL_INBOX_DIR: MAIL_DIR,
            },
          },
        );
        await waitForUrl(`http://127.0.0.1:${WEATHER_PORT}/health`, 20_000);
        await waitForUrl(`${baseUrl}/sign-in`, 60_000);

        const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
        await context.clock.install({ time: new Date(target) });
        const page = await context.newPage();
        await signIn(page, baseUrl, "tech1@demo.sward.test");
        await page.waitForURL("**/today");
        const first = demoCompany.properties.find(
          (p) => p.key === demoCompany.schedule!.today.tech1![0],
        )!;
        const stop = page.getByRole("link", { name: new RegExp(first.name) });
        await stop.waitFor();
        expect(await stop.innerText()).toContain(PLANNED_SERVICES[service]);
        await snap(page, `seasons-${date}-01-today`);

        await stop.click();
        await page.waitForURL(/\/visits\/[0-9a-f-]+$/);
        const note = await page.getByText(/^Office note:/).innerText();
        const calls = note.match(/Apply (.+?) at ([\d.]+) lb per 1,000 ft²/);
        expect(Boolean(calls), note).toBe(service !== "inspection");
        await page.getByRole("button", { name: "Start visit" }).click();
        await page.waitForURL(/zone=/);

        for (const [i, zone] of first.zones.entries()) {
          await page.getByRole("heading", { name: zone.name, exact: true }).waitFor();
          if (i === 0 && calls) {
            const [, product, rateLb] = calls;
            await page.getByRole("button", { name: "Record an application" }).click();
            const select = page.getByLabel("Product");
            const option = await select
              .locator("option", { hasText: product! })
              .first()
              .textContent();
            await select.selectOption({ label: option!.trim() });
            await page.getByLabel("Rate", { exact: true }).fill(rateLb!);
            if (/herbicide|insecticide/.test(product!)) {
              await page.getByLabel(/^Certified applicator/).fill("Luis Arroyo");
              await page.getByLabel(/^Certification/).fill("DEMO-CA-10482");
            }
            await page.getByRole("button", { name: "Record application" }).click();
            await page
              .getByRole("list", { name: "Applications on this zone" })
              .getByText(product!.split(" (")[0]!)
              .waitFor({ timeout: 15_000 });
            await snap(page, `seasons-${date}-02-application`);
          }
          for (const label of ["Overall quality", "Color", "Density", "Uniformity"])
            await rate(page, label, 7);
          await page.getByRole("button", { name: "Mark zone done" }).click();
          await waitSaved(page);
          const next = first.zones[i + 1];
          await page
            .getByRole("button", { name: next ? `Next: ${next.name}` : "Review and finish" })
            .click();
        }
        await page.getByRole("button", { name: /^Finish visit/ }).click();
        await page.getByText(/^Finished at/).waitFor({ timeout: 15_000 });
        await snap(page, `seasons-${date}-03-finished`);
        await context.close();
      } finally {
        await sup.stop();
      }
    }, 240_000);
  }
});
