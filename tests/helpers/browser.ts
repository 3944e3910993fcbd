// Chromium for e2e tests: Debian's /usr/bin/chromium driven by playwright-core.
import { chromium, type Browser, type Page } from "playwright-core";

import { DEMO_PASSWORD } from "@/fixtures/demo/scenario";

const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium";

export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 900 };

export async function signIn(
  page: Page,
  baseUrl: string,
  email: string,
  password = DEMO_PASSWORD,
): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel("E-mail", { exact: true }).fill(email);
  await page.getByLabel("Password", { exact: true }).fill(password);
  await page.getByRole("button", { name: "Sign in" }).click();
}
