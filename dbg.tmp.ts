import { chromium } from "playwright-core";
const b = await chromium.launch({ executablePath: "/usr/bin/chromium", args: ["--headless","--no-sandbox","--disable-gpu","--disable-quic","--no-first-run"] });
const ctx = await b.newContext({ viewport: { width: 1280, height: 800 }, baseURL: "http://localhost:3810" });
const page = await ctx.newPage();
page.on("console", (m) => console.log("console", m.type(), m.text().slice(0, 300)));
page.on("pageerror", (e) => console.log("pageerror", e.message));
await page.goto("/sign-in");
await page.getByLabel("E-mail", { exact: true }).fill("manager@demo.sward.test");
await page.getByLabel("Password", { exact: true }).fill("meadow-demo-2026");
await page.getByRole("button", { name: "Sign in" }).click();
await page.waitForURL("**/book");
const t = Date.now();
await page.goto("/book/map");
for (let i = 0; i < 20; i++) {
  const s = await page.evaluate(() => {
    const el = document.querySelector("[data-book-map]") as any;
    const m = el?.swardMap;
    return { state: el?.getAttribute("data-map-state"), has: !!m, loaded: m?.loaded(), tiles: m?.areTilesLoaded(), pts: m ? m.queryRenderedFeatures({ layers: ["properties"] }).length : -1 };
  }).catch((e) => String(e));
  console.log(Date.now() - t, JSON.stringify(s));
  if (typeof s === "object" && s.pts >= 6) break;
  await page.waitForTimeout(1000);
}
await page.screenshot({ path: "/tmp/map-dbg.png" });
await b.close();
