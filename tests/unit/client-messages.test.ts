// The catalogue's words reach every staff component: a NextIntlClientProvider nested in a staff
// page replaces the layout's messages rather than merging with them, so each one must pass the
// staff words (lib/i18n/staff-messages.ts) along with its own. Found when the visit page, given a
// provider of its own for the seed-rate hint, showed "offline.savedWaiting" instead of "Kept on
// this phone · sends when there is a signal" — only offline, where the page-wide word scan
// (tests/e2e/plain-words.test.ts) never looks.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";

import { en } from "@/lib/i18n/messages/en";
import { staffClientMessages } from "@/lib/i18n/staff-messages";

function filesUnder(dir: string): string[] {
  return readdirSync(dir, { withFileTypes: true }).flatMap((e) => {
    const full = path.join(dir, e.name);
    return e.isDirectory() ? filesUnder(full) : /\.tsx$/.test(e.name) ? [full] : [];
  });
}

describe("client messages on staff pages", () => {
  it("the staff words hold the outbox's and a conflict's namespaces", () => {
    const m = staffClientMessages(en as unknown as Record<string, never>);
    expect(m.offline).toBe(en.offline);
    expect(Object.keys(m.audit).sort()).toEqual(["blank", "fields", "no", "symptoms", "yes"]);
  });

  it("every NextIntlClientProvider under app/(staff) passes the staff words too", () => {
    const files = filesUnder("app/(staff)");
    const withProvider = files.filter((f) =>
      readFileSync(f, "utf8").includes("<NextIntlClientProvider"),
    );
    expect(withProvider.length).toBeGreaterThanOrEqual(3);
    for (const f of withProvider) {
      const source = readFileSync(f, "utf8");
      const providers = source.split("<NextIntlClientProvider").length - 1;
      const passing = source.split("staffClientMessages(messages)").length - 1;
      expect(passing, `${f}: ${providers} provider(s), ${passing} with the staff words`).toBe(
        providers,
      );
    }
  });
});
