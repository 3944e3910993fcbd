// The installable app and what its service worker may keep (lib/pwa/, app/manifest.ts,
// public/icons). Offline behaviour in a browser: tests/e2e/offline-shell.test.ts.
import path from "node:path";
import sharp from "sharp";
import { describe, expect, it } from "vitest";

import manifest from "@/app/manifest";
import { dayUrls, SHARED_URLS, stopUrls, visitUrls } from "@/lib/pwa/day-urls";
import { isFieldData, isFieldPage, isSignInPath, isVisitPage } from "@/lib/pwa/field-routes";

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
      `/api/v1/visits/${VISIT}/audit`,
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
        status: "scheduled",
        photos: [],
        lastChecks: [
          { photo: { thumbUrl: thumb } },
          { photo: null },
          { photo: { thumbUrl: thumb } },
        ],
      }),
    ).toEqual([thumb]);
    expect(visitUrls({ id: VISIT, status: "completed", photos: [], lastChecks: [] })).toEqual([
      `/api/v1/visits/${VISIT}/audit`,
    ]);
  });

  it("every address fetched ahead is one the service worker keeps", () => {
    const all = [
      ...dayUrls("2026-12-03", "2026-12-03"),
      ...SHARED_URLS,
      ...stopUrls({ id: VISIT }),
      `/api/v1/photos/${PHOTO}/thumb`,
      `/api/v1/visits/${VISIT}/audit`,
    ];
    for (const url of all) {
      const { pathname } = new URL(url, "http://localhost");
      expect(isFieldPage(pathname) || isFieldData(pathname), url).toBe(true);
    }
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
