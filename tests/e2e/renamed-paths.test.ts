// Pages renamed for the glossary (the book, risk alerts, visit reports) still answer at their old
// paths, over HTTP against the production server: bookmarks and links in e-mails already sent
// land on the new page with their query string, and each role still lands where it belongs.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, inject, it } from "vitest";

import { mintSessionCookie, useE2eDatabase } from "../helpers/e2e-db";

const BASE = inject("baseUrl");
let manager = "";
let tech = "";

beforeAll(async () => {
  useE2eDatabase();
  const c = await (await import("../helpers/factories")).createTestCompany();
  manager = await mintSessionCookie(c.userIds["manager"]!);
  tech = await mintSessionCookie(c.userIds["tech1"]!);
}, 60_000);

const get = (path: string, cookie = "") =>
  fetch(`${BASE}${path}`, { redirect: "manual", headers: cookie ? { cookie } : {} });

describe("renamed pages", () => {
  it("the risk alerts of an old digest link: /alerts → /risk-alerts, permanently, filters kept", async () => {
    const res = await get("/alerts?severity=high", manager);
    expect(res.status).toBe(308);
    expect(res.headers.get("location")).toBe("/risk-alerts?severity=high");
    const page = await get("/risk-alerts?severity=high", manager);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('<h1 class="text-3xl font-bold">Risk alerts</h1>');
  });

  it("a visit report e-mailed before the rename: /my-lawn/visits/:id → /my-lawn/reports/:id", async () => {
    const id = randomUUID();
    const res = await get(`/my-lawn/visits/${id}`);
    expect(res.status).toBe(308);
    expect(res.headers.get("location")).toBe(`/my-lawn/reports/${id}`);
    // Signed out, the report sends the reader to sign in and back to the report's new path.
    const report = await get(`/my-lawn/reports/${id}`);
    expect(report.status).toBe(307);
    expect(report.headers.get("location")).toBe(
      `/sign-in?callbackUrl=${encodeURIComponent(`/my-lawn/reports/${id}`)}`,
    );
  });

  it("a manager's old book bookmark /properties goes to /book with its filters", async () => {
    const res = await get("/properties?trend=declining&sort=name", manager);
    expect(res.status).toBe(307);
    expect(res.headers.get("location")).toBe("/book?trend=declining&sort=name");
    const book = await get("/book?trend=declining&sort=name", manager);
    expect(book.status).toBe(200);
    expect(await book.text()).toContain("Every property");
  });

  it("a technician keeps their properties at /properties and is sent away from the book", async () => {
    const mine = await get("/properties", tech);
    expect(mine.status).toBe(200);
    expect(await mine.text()).toContain("The properties assigned to you.");
    const book = await get("/book", tech);
    expect(book.status).toBe(307);
    expect(book.headers.get("location")).toBe("/today");
  });
});
