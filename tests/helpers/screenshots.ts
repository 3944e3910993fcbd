// Screenshots taken by e2e tests, kept under tests/.artifacts/screenshots (git-ignored) to look at.
import { mkdirSync } from "node:fs";
import type { Page } from "playwright-core";

const DIR = "tests/.artifacts/screenshots";

export async function snap(page: Page, name: string, fullPage = false): Promise<string> {
  mkdirSync(DIR, { recursive: true });
  const path = `${DIR}/${name}.png`;
  await page.screenshot({ path, fullPage });
  return path;
}
