// Is the production build (.next) older than the code it serves? Used by the e2e setup, the
// crash suite and `npm run demo`, which must never run against old code.
import { existsSync, readdirSync, statSync } from "node:fs";
import path from "node:path";

const SOURCE_DIRS = ["app", "components", "lib", "db", "fixtures", "public"];
/** Files at the top that the build reads too (the proxy, the configuration, the dependencies). */
const SOURCE_FILES = [
  "proxy.ts",
  "next.config.ts",
  "package-lock.json",
  "postcss.config.mjs",
  "tailwind.config.ts",
];

/** No build, or a source file changed after it. */
export function isBuildStale(): boolean {
  if (!existsSync(".next/BUILD_ID")) return true;
  const built = statSync(".next/BUILD_ID").mtimeMs;
  const newest = (dir: string): number =>
    readdirSync(dir, { withFileTypes: true }).reduce((max, entry) => {
      const full = path.join(dir, entry.name);
      return Math.max(max, entry.isDirectory() ? newest(full) : statSync(full).mtimeMs);
    }, 0);
  return (
    SOURCE_DIRS.some((dir) => existsSync(dir) && newest(dir) > built) ||
    SOURCE_FILES.some((file) => existsSync(file) && statSync(file).mtimeMs > built)
  );
}
