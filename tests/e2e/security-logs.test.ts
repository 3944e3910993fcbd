// Security logging (OWASP ASVS 5.0 V16): the production server writes sign-ins, failed sign-ins
// and refused authorisations as JSON lines, with no password, no token and no full e-mail
// address in them, and CR/LF in what a client sends cannot forge a line. Reads the log file of the
// e2e server (tests/helpers/e2e-setup.ts) after provoking each event over HTTP.
import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, inject, it } from "vitest";

import { mintSessionCookie, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { passwordSignIn } from "../helpers/password-sign-in";

const BASE = inject("baseUrl");
const LOG = inject("serverLog");
const FORGED = '{"level":30,"event":"sign_in","forged":true}';
let c: TestCompany;

const signIn = (email: string, password: string) => passwordSignIn(BASE, email, password);

beforeAll(async () => {
  useE2eDatabase();
  c = await (await import("../helpers/factories")).createTestCompany();
}, 60_000);

describe("security logs", () => {
  it("records sign-ins, failures and refusals as JSON lines, without secrets, and CR/LF cannot forge a line", async () => {
    const { TEST_PASSWORD } = await import("../helpers/factories");
    const secretPassword = `Wrong-Horse-Battery-${Date.now()}\r\n${FORGED}`;
    const failed = await signIn(c.emails["tech2"]!, secretPassword);
    const ok = await signIn(c.emails["manager"]!, TEST_PASSWORD);
    expect(ok.sessionToken).not.toBe("");
    // Refused authorisations: anonymous (401) and a technician at a manager's route (403), one with CR/LF in the query.
    const tech = await mintSessionCookie(c.userIds["tech1"]!);
    const refusals = [
      await fetch(`${BASE}/api/v1/book?q=${encodeURIComponent(`x\r\n${FORGED}`)}`),
      await fetch(`${BASE}/api/v1/book`, { headers: { cookie: tech } }),
      await fetch(`${BASE}/api/v1/products`, {
        method: "POST",
        headers: { cookie: tech, origin: BASE, "content-type": "application/json" },
        body: "{}",
      }),
    ];
    expect(refusals.map((r) => r.status)).toEqual([401, 403, 403]);

    // pino writes synchronously; give the file a moment all the same.
    let lines: string[] = [];
    for (let i = 0; i < 20; i++) {
      lines = readFileSync(LOG, "utf8")
        .split("\n")
        .filter((l) => l.trim() !== "");
      if (lines.some((l) => l.includes(c.userIds["manager"]!))) break;
      await new Promise((r) => setTimeout(r, 100));
    }
    const entries = lines.map((l) => {
      try {
        return JSON.parse(l) as Record<string, unknown>;
      } catch {
        return null;
      }
    });
    // Next's own start-up banner ("▲ Next.js …", "- Local: …", "✓ Ready …") is not a log line of ours.
    const banner = (l: string) => /^(▲|- |✓ |\s)/.test(l);
    const notJson = lines.filter(
      (l, i) => !banner(l) && (entries[i] === null || typeof entries[i] !== "object"),
    );
    const events = entries.filter((e): e is Record<string, unknown> => e !== null);
    const signIns = events.filter(
      (e) => e.event === "sign_in" && e.userId === c.userIds["manager"],
    );
    const failures = events.filter(
      (e) =>
        e.event === "sign_in_failed" &&
        typeof e.user === "string" &&
        (e.user as string).startsWith("t…@"),
    );
    const refused = events.filter(
      (e) =>
        e.event === "access_refused" &&
        (e.path === "/api/v1/book" || e.path === "/api/v1/products"),
    );
    const all = lines.join("\n");
    const emails = Object.values(c.emails).filter((email) => all.includes(email));
    const secrets = [
      secretPassword.split("\r")[0]!,
      TEST_PASSWORD,
      ok.sessionToken,
      failed.csrfToken,
      ok.csrfToken,
      tech.split("=")[1]!,
    ].filter((x) => all.includes(x));
    const forged = events.filter((e) => e.forged === true);
    console.log(
      `logs: ${lines.length} lines, ${notJson.length} not JSON; sign-ins ${signIns.length}, failed sign-ins ${failures.length}, refused authorisations ${refused.length}; passwords or tokens in the log ${secrets.length}, full e-mail addresses ${emails.length}, forged lines ${forged.length}`,
    );
    expect(notJson).toEqual([]);
    expect(signIns.length).toBeGreaterThanOrEqual(1);
    expect(failures.length).toBeGreaterThanOrEqual(1);
    expect(refused.length).toBeGreaterThanOrEqual(3);
    expect(secrets).toEqual([]);
    expect(emails).toEqual([]);
    expect(forged).toEqual([]);
    for (const e of [...signIns, ...failures, ...refused])
      expect(typeof e.time === "number" && typeof e.level === "number").toBe(true);
  });
});
