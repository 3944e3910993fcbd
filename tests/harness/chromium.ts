// Makes sure Debian's Chromium is installed (e2e tests drive it); installs it with apt-get as root.
import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";

export function ensureChromium(path = process.env.CHROMIUM_PATH ?? "/usr/bin/chromium"): string {
  if (existsSync(path)) return path;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot) {
    throw new Error(
      `Chromium not found at ${path}. Install it with: sudo apt-get install chromium (or set CHROMIUM_PATH).`,
    );
  }
  console.log("setup: installing Debian's chromium package (apt-get)…");
  execFileSync(
    "sh",
    [
      "-c",
      "apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq chromium >/dev/null",
    ],
    {
      stdio: "inherit",
    },
  );
  if (!existsSync(path)) throw new Error(`apt-get finished but ${path} is still missing.`);
  return path;
}
