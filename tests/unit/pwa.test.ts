// The installable app and what its service worker may keep (lib/pwa/, app/manifest.ts,
// public/icons). Offline behaviour in a browser: tests/e2e/offline-shell.test.ts.
import { existsSync, readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import sharp from "sharp";
import { describe, expect, it } from "vitest";

import manifest from "@/app/manifest";
import { dayUrls, SHARED_URLS, stopUrls, visitUrls } from "@/lib/pwa/day-urls";
import { isFieldData, isFieldPage, isSignInPath, isVisitPage } from "@/lib/pwa/field-routes";

/** The roles a GET of `url` is open to, read from its route file: `access: [...]` of a route
 * handler (ROLES: every role), `requireActor([...])` of a page (app/(staff) pages). */
function rolesFor(url: string): string[] {
  const { pathname } = new URL(url, "http://localhost");
  const parts = pathname.split("/").filter(Boolean);
  const api = parts[0] === "api";
  const find = (dir: string, rest: string[]): string | null => {
    if (rest.length === 0) {
      const file = path.join(dir, api ? "route.ts" : "page.tsx");
      return existsSync(file) ? file : null;
    }
    const [head, ...tail] = rest as [string, ...string[]];
    for (const entry of readdirSync(dir, { withFileTypes: true })) {
      if (!entry.isDirectory()) continue;
      const group = /^\(.+\)$/.test(entry.name);
      const dynamic = /^\[[^.\]]+\]$/.test(entry.name);
      const next = path.join(dir, entry.name);
      const hit = group
        ? find(next, rest)
        : entry.name === head || dynamic
          ? find(next, tail)
          : null;
      if (hit) return hit;
    }
    return null;
  };
  const file = find(path.resolve("app"), parts);
  if (!file) throw new Error(`no route file for ${url}`);
  const src = readFileSync(file, "utf8");
  if (api) {
    const get = src.slice(src.indexOf("export const GET"));
    if (/access:\s*ROLES\b/.test(get)) return ["manager", "technician", "homeowner"];
    const m = /access:\s*\[([^\]]*)\]/.exec(get);
    if (!m) throw new Error(`no access list in ${file}`);
    return [...m[1]!.matchAll(/"(\w+)"/g)].map((x) => x[1]!);
  }
  const m = /requireActor\(\s*\[([^\]]*)\]/.exec(src);
  if (!m) throw new Error(`no requireActor in ${file}`);
  return [...m[1]!.matchAll(/"(\w+)"/g)].map((x) => x[1]!);
}

const VISIT = "0b7a3c4e-9d2f-4e61-8a55-1f2e3d4c5b6a";
const PHOTO = "6f1e2d3c-4b5a-4978-8a6b-5c4d3e2f1a0b";

describe("what the service worker may keep (lib/pwa/field-routes.ts)", () => {
  it("keeps the field pages: Today and one visit", () => {
    expect(isFieldPage("/today")).toBe(true);
    expect(isFieldPage(`/visits/${VISIT}`)).toBe(true);
    expect(isVisitPage(`/visits/${VISIT}`)).toBe(true);
    expect(isVisitPage("/today")).toBe(false);
  });

  it("never keeps sign-in, office pages, the homeowner's pages or a visit's sub-pages", () => {
    for (const p of [
      "/sign-in",
      "/book",
      "/visits",
      "/visits/new",
      `/visits/${VISIT}/report`,
      "/properties",
      "/settings",
      "/my-lawn",
      "/todayx",
      "/offline",
    ])
      expect(isFieldPage(p), p).toBe(false);
  });

  it("keeps the reads behind the field screens and nothing else of the API", () => {
    for (const p of [
      "/api/v1/today",
      `/api/v1/visits/${VISIT}`,
      "/api/v1/products",
      "/api/v1/rule-sets",
      "/api/v1/me/applicator",
      `/api/v1/photos/${PHOTO}/thumb`,
    ])
      expect(isFieldData(p), p).toBe(true);
    for (const p of [
      "/api/v1/book",
      "/api/v1/book/export",
      "/api/v1/people",
      "/api/v1/me",
      `/api/v1/photos/${PHOTO}/display`,
      `/api/v1/visits/${VISIT}/finish`,
      `/api/v1/visits/${VISIT}/audit`,
      "/api/v1/visits",
      "/api/auth/session",
      "/api/v1/records/applications",
    ])
      expect(isFieldData(p), p).toBe(false);
  });

  it("leaves sign-in alone, even for the offline page", () => {
    expect(isSignInPath("/sign-in")).toBe(true);
    expect(isSignInPath("/sign-in/link")).toBe(true);
    expect(isSignInPath("/api/auth/callback/nodemailer")).toBe(true);
    expect(isSignInPath("/book")).toBe(false);
  });
});

describe("the day's addresses fetched ahead on Today (lib/pwa/day-urls.ts)", () => {
  it("are the screens' own requests: the page, its list, each stop, its thumbnails", () => {
    expect(dayUrls("2026-12-03", "2026-12-03")).toEqual([
      "/today",
      "/api/v1/today?date=2026-12-03",
    ]);
    expect(dayUrls("2026-12-04", "2026-12-03")[0]).toBe("/today?date=2026-12-04");
    expect(stopUrls({ id: VISIT })).toEqual([`/visits/${VISIT}`, `/api/v1/visits/${VISIT}`]);
    const thumb = `/api/v1/photos/${PHOTO}/thumb`;
    expect(
      visitUrls({
        id: VISIT,
        photos: [],
        lastChecks: [
          { photo: { thumbUrl: thumb } },
          { photo: null },
          { photo: { thumbUrl: thumb } },
        ],
      }),
    ).toEqual([thumb]);
    // A finished visit: its thumbnails only, never the managers' audit trail.
    expect(visitUrls({ id: VISIT, photos: [{ thumbUrl: thumb }], lastChecks: [] })).toEqual([
      thumb,
    ]);
  });

  it("every address fetched ahead is one the service worker keeps", () => {
    const all = [
      ...dayUrls("2026-12-03", "2026-12-03"),
      ...SHARED_URLS,
      ...stopUrls({ id: VISIT }),
      `/api/v1/photos/${PHOTO}/thumb`,
    ];
    for (const url of all) {
      const { pathname } = new URL(url, "http://localhost");
      expect(isFieldPage(pathname) || isFieldData(pathname), url).toBe(true);
    }
  });

  it("every address fetched ahead is one a technician may read (its route's own access list)", () => {
    // Today is the technician's page: an address a technician is refused can never be saved, and
    // one such address left every day with a finished stop "saved with gaps" (the audit trail).
    const all = [
      ...dayUrls("2026-12-04", "2026-12-03"),
      ...SHARED_URLS,
      ...stopUrls({ id: VISIT }),
      ...visitUrls({
        id: VISIT,
        photos: [{ thumbUrl: `/api/v1/photos/${PHOTO}/thumb` }],
        lastChecks: [{ photo: { thumbUrl: `/api/v1/photos/${PHOTO}/thumb` } }],
      }),
    ];
    for (const url of all) expect(rolesFor(url), url).toContain("technician");
    // The check itself refuses what a technician may not read.
    expect(rolesFor(`/api/v1/visits/${VISIT}/audit`)).toEqual(["manager"]);
  });
});

describe("the web app manifest and its icons (app/manifest.ts, public/icons)", () => {
  const m = manifest();
  const icons = path.join(process.cwd(), "public");

  it("opens standalone on Today", () => {
    expect(m).toMatchObject({ name: "Sward", start_url: "/today", display: "standalone" });
  });

  // Chromium's install criteria ask for a 192 px and a 512 px icon (web.dev, "What does it take to
  // be installable?", from memory); each PNG is the size the manifest says.
  it("lists 192 and 512 px icons whose files have those sizes", async () => {
    const sizes = new Set<string>();
    for (const icon of m.icons ?? []) {
      const meta = await sharp(path.join(icons, icon.src)).metadata();
      expect(meta.format).toBe("png");
      expect(`${meta.width}x${meta.height}`, icon.src).toBe(icon.sizes);
      sizes.add(icon.sizes!);
    }
    expect(sizes).toEqual(new Set(["192x192", "512x512"]));
    expect(m.icons?.some((i) => i.purpose === "maskable")).toBe(true);
  });

  // W3C Web App Manifest, "icon masks": a maskable icon keeps its content inside the safe zone,
  // a centred circle whose radius is 40 % of the icon's size; the rest may be cropped away.
  it("keeps the maskable icon's mark inside the safe zone, on a full background", async () => {
    const icon = m.icons!.find((i) => i.purpose === "maskable")!;
    const { data, info } = await sharp(path.join(icons, icon.src))
      .raw()
      .toBuffer({ resolveWithObject: true });
    const at = (x: number, y: number) => {
      const i = (y * info.width + x) * info.channels;
      return [data[i]!, data[i + 1]!, data[i + 2]!, info.channels === 4 ? data[i + 3]! : 255];
    };
    const background = at(0, 0);
    expect(background[3]).toBe(255); // opaque corners: nothing transparent to crop into
    const c = info.width / 2;
    let outside = 0;
    let inside = 0;
    for (let y = 0; y < info.height; y += 2)
      for (let x = 0; x < info.width; x += 2) {
        const px = at(x, y);
        const isMark = px.some((v, k) => Math.abs(v - background[k]!) > 24);
        if (!isMark) continue;
        if (Math.hypot(x + 0.5 - c, y + 0.5 - c) > 0.4 * info.width) outside += 1;
        else inside += 1;
      }
    expect(inside).toBeGreaterThan(100);
    expect(outside).toBe(0);
  });
});
