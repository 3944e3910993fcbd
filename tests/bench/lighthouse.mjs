// One Lighthouse 12 run (mobile emulation, the default) of a URL with an optional cookie header,
// in Debian's Chromium; prints { performance, accessibility } as one JSON line (0–100).
// `node tests/bench/lighthouse.mjs <url> [cookie]` — used by `npm run bench`, three times per page.
import * as chromeLauncher from "chrome-launcher";
import lighthouse from "lighthouse";

const [url, cookie] = process.argv.slice(2);
const chrome = await chromeLauncher.launch({
  chromePath: process.env.CHROME_PATH ?? "/usr/bin/chromium",
  chromeFlags: ["--headless=new", "--no-sandbox", "--disable-gpu", "--disable-dev-shm-usage"],
});
try {
  const result = await lighthouse(url, {
    port: chrome.port,
    output: "json",
    logLevel: "error",
    onlyCategories: ["performance", "accessibility"],
    extraHeaders: cookie ? { Cookie: cookie } : undefined,
  });
  const c = result.lhr.categories;
  if (result.lhr.runtimeError) throw new Error(result.lhr.runtimeError.message);
  // A page that sent Lighthouse to sign in would score the sign-in page: refuse that.
  if (new URL(result.lhr.finalDisplayedUrl).pathname !== new URL(url).pathname)
    throw new Error(`Lighthouse ended on ${result.lhr.finalDisplayedUrl}, not ${url}`);
  console.log(
    JSON.stringify({
      performance: Math.round((c.performance.score ?? 0) * 100),
      accessibility: Math.round((c.accessibility.score ?? 0) * 100),
    }),
  );
} finally {
  await chrome.kill();
}
