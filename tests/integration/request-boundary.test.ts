// The request boundary (the one guard, lib/auth/guard.ts) through the real route handlers:
// forged keyset cursors are 422 with a plain message, never an SQL error; control characters in
// query strings are stripped from search text and refused elsewhere; the CSV export is whole or
// an error status, never a 200 cut short; and a JSON body above its route's limit is 413 before
// it is read (declared length) or as soon as the count passes the limit (chunked or lying).
import { parse } from "csv-parse/sync";
import fc from "fast-check";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import { BOOK_SORTS } from "@/lib/book/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { CONTROL_ALPHABET } from "../helpers/hostile-text";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const book = await import("@/app/api/v1/book/route");
const bookExport = await import("@/app/api/v1/book/export/route");
const alerts = await import("@/app/api/v1/alerts/route");
const people = await import("@/app/api/v1/people/route");
const visits = await import("@/app/api/v1/visits/route");
const today = await import("@/app/api/v1/today/route");
const records = await import("@/app/api/v1/records/applications/route");
const properties = await import("@/app/api/v1/properties/route");

let c: TestCompany;
beforeAll(async () => {
  c = await createTestCompany();
  for (const id of Object.values(c.propertyIds))
    await evaluateProperty(testDb(), c.companyId, id, { provider: null });
});

const get = (handler: (r: Request) => Promise<Response>, path: string) =>
  handler(new Request(`http://localhost${path}`));
const cursor = (value: unknown) => Buffer.from(JSON.stringify(value)).toString("base64url");
const UUID = "3f1c2b8e-7d4a-4e5b-9c6d-0a1b2c3d4e5f";

describe("forged book cursors", () => {
  // For each sort: values of the wrong type, out of the column's range, impossible dates, ids that
  // are not UUIDs, wrong shapes, and bytes that are not a cursor at all.
  const forged: [string, unknown][] = [
    ["a string for a number", ["abc", UUID]],
    ["a numeric string", ["12", UUID]],
    ["1e40", [1e40, UUID]],
    ["-1e40", [-1e40, UUID]],
    ["5e-324 (underflows a real)", [5e-324, UUID]],
    ["2^31", [2 ** 31, UUID]],
    ["a fraction for an integer", [1.5, UUID]],
    ["an impossible date", ["2026-02-30", UUID]],
    ["year 0", ["0000-01-01", UUID]],
    ["a date with a time", ["2026-01-01T00:00:00Z", UUID]],
    ["a 36-character non-UUID", [1, "zzzzzzzz-zzzz-zzzz-zzzz-zzzzzzzzzzzz"]],
    ["36 dashes", [1, "-".repeat(36)]],
    ["a number for the id", [1, 42]],
    ["three items", [1, UUID, 3]],
    ["one item", [1]],
    ["an object", { 0: 1, 1: UUID }],
    ["null", null],
    ["NUL in text", ["a\u0000b", UUID]],
    ["a nested array", [[1], UUID]],
    ["true", [true, UUID]],
  ];
  const accepted = (sort: string, value: unknown) => {
    // What a real cursor of that sort could hold: the only forged values that may pass.
    if (!Array.isArray(value) || value.length !== 2 || value[1] !== UUID) return false;
    const v = value[0] as unknown;
    if (sort === "name") return typeof v === "string" && !v.includes("\u0000");
    if (sort === "last" || sort === "next") return false;
    if (sort === "attention") return Number.isInteger(v) && Math.abs(v as number) < 2 ** 31;
    return typeof v === "number" && Math.abs(v) <= 3.4e38 && (v === 0 || Math.abs(v) >= 1.18e-38);
  };

  it(`${forged.length} forged values × ${BOOK_SORTS.length} sorts → 422 with a plain message (or a page for a value a real cursor could hold)`, async () => {
    current = await c.actor("manager");
    let refused = 0;
    for (const sort of BOOK_SORTS)
      for (const [what, value] of forged) {
        const res = await get(book.GET, `/api/v1/book?sort=${sort}&after=${cursor(value)}`);
        const body = (await res.json()) as { error?: { message: string } };
        const expected = accepted(sort, value) ? 200 : 422;
        expect(res.status, `${sort}: ${what}`).toBe(expected);
        if (expected === 422) {
          refused++;
          expect(body.error!.message).toBe(
            "That page link is no longer valid. Start again from the first page.",
          );
        }
      }
    expect(refused).toBeGreaterThan(forged.length * BOOK_SORTS.length * 0.7);
    for (const junk of ["%00", "not-base64!!", "x".repeat(300), "%E2%80%A8"]) {
      const res = await get(book.GET, `/api/v1/book?after=${junk}`);
      expect([422], junk).toContain(res.status);
    }
  });

  it("any JSON in a cursor is a page or 422, never a 5xx (fast-check)", async () => {
    current = await c.actor("manager");
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...BOOK_SORTS),
        fc.oneof(
          fc.tuple(
            fc.jsonValue(),
            fc.oneof(fc.uuid(), fc.string({ minLength: 36, maxLength: 36 })),
          ),
          fc.jsonValue(),
        ),
        async (sort, value) => {
          const res = await get(book.GET, `/api/v1/book?sort=${sort}&after=${cursor(value)}`);
          expect([200, 422]).toContain(res.status);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("a real cursor still pages through the whole book, in every sort", async () => {
    current = await c.actor("manager");
    for (const sort of BOOK_SORTS) {
      const names: string[] = [];
      let after = "";
      for (let i = 0; i < 10; i++) {
        const res = await get(book.GET, `/api/v1/book?sort=${sort}&limit=2${after}`);
        expect(res.status, sort).toBe(200);
        const page = (await res.json()) as { rows: { name: string }[]; nextCursor: string | null };
        names.push(...page.rows.map((r) => r.name));
        if (!page.nextCursor) break;
        after = `&after=${page.nextCursor}`;
      }
      expect(names, sort).toHaveLength(6);
      expect(new Set(names).size, sort).toBe(6);
    }
  });
});

describe("control characters in query strings", () => {
  it("search text drops them (book, export, alerts); the answer is the same as without", async () => {
    current = await c.actor("manager");
    for (const ch of CONTROL_ALPHABET) {
      const q = encodeURIComponent(`sedge${ch}field`);
      const res = await get(book.GET, `/api/v1/book?q=${q}`);
      expect(res.status, JSON.stringify(ch)).toBe(200);
      const rows = ((await res.json()) as { rows: { name: string }[] }).rows;
      expect(rows.map((r) => r.name)).toEqual(["Haddad residence"]);
      const area = await get(alerts.GET, `/api/v1/alerts?area=${encodeURIComponent(ch)}`);
      expect(area.status, JSON.stringify(ch)).toBe(200);
    }
    const exported = await get(bookExport.GET, `/api/v1/book/export?q=%00`);
    expect(exported.status).toBe(200);
    const rows = parse(await exported.text(), { columns: true, bom: true }) as unknown[];
    expect(rows).toHaveLength(6);
  });

  it("other query values holding one are 422 with a plain message, never a 5xx", async () => {
    current = await c.actor("manager");
    const paths = [
      (ch: string) => `/api/v1/people?role=homeowner${ch}`,
      (ch: string) => `/api/v1/visits?date=2026-06-01${ch}`,
      (ch: string) => `/api/v1/today?date=2026-06-01${ch}`,
      (ch: string) => `/api/v1/records/applications?from=2026-01-01${ch}&to=2026-12-31`,
      (ch: string) => `/api/v1/properties?archived=include${ch}`,
    ];
    const handlers = [people.GET, visits.GET, today.GET, records.GET, properties.GET];
    for (const ch of CONTROL_ALPHABET)
      for (const [i, path] of paths.entries()) {
        const res = await get(handlers[i]!, path(encodeURIComponent(ch)));
        expect(res.status, `${path("·")} ${JSON.stringify(ch)}`).toBe(422);
        const body = (await res.json()) as { error: { message: string } };
        expect(body.error.message).toMatch(/not allowed|attention/);
      }
  });
});

describe("JSON body limits", () => {
  const post = properties;
  const limit = 64 * 1024; // the guard's DEFAULT_MAX_BODY_BYTES

  /** A body stream that counts what the server pulls from it. */
  function countingBody(totalBytes: number, chunkBytes = 64 * 1024) {
    const state = { pulled: 0 };
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        if (state.pulled >= totalBytes) return controller.close();
        const n = Math.min(chunkBytes, totalBytes - state.pulled);
        state.pulled += n;
        controller.enqueue(new Uint8Array(n).fill(0x20));
      },
    });
    return { stream, state };
  }
  const request = (body: ReadableStream<Uint8Array>, headers: Record<string, string> = {}) =>
    new Request("http://localhost/api/v1/properties", {
      method: "POST",
      body,
      headers: {
        origin: "http://localhost:3000",
        host: "localhost",
        "content-type": "application/json",
        ...headers,
      },
      duplex: "half",
    } as RequestInit);

  it("a declared 100 MB body is 413 before a byte is read", async () => {
    current = await c.actor("manager");
    const { stream, state } = countingBody(100 * 1024 * 1024);
    const started = performance.now();
    const res = await post.POST(request(stream, { "content-length": String(100 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { message: string } }).error.message).toBe(
      "The request body is larger than 64 KB. Send a smaller one.",
    );
    expect(state.pulled).toBeLessThanOrEqual(64 * 1024); // at most what the stream buffered ahead
    console.log(
      `body limit: declared 100 MB → 413 in ${(performance.now() - started).toFixed(1)} ms, ${state.pulled} bytes pulled`,
    );
  });

  it("a chunked (undeclared) or understated body is cut as soon as the count passes the limit", async () => {
    current = await c.actor("manager");
    for (const headers of [{}, { "content-length": "100" }] as Record<string, string>[]) {
      const { stream, state } = countingBody(100 * 1024 * 1024);
      const res = await post.POST(request(stream, headers));
      expect(res.status).toBe(413);
      expect(state.pulled).toBeLessThan(limit + 3 * 64 * 1024);
    }
  });

  it("a body just under the limit is read and judged by the schema (422 here, not 413)", async () => {
    current = await c.actor("manager");
    const text = JSON.stringify({ name: "x".repeat(limit - 100) });
    expect(Buffer.byteLength(text)).toBeLessThan(limit);
    const res = await post.POST(
      new Request("http://localhost/api/v1/properties", {
        method: "POST",
        body: text,
        headers: {
          origin: "http://localhost:3000",
          host: "localhost",
          "content-type": "application/json",
        },
      }),
    );
    expect(res.status).toBe(422);
  });
});
