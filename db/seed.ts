// Seeds the demo scenario: `tsx db/seed.ts [--reset]`. Without --reset a company that already
// exists is left as it is, so running the demo again keeps what you entered.
import { DEMO_PASSWORD, demoScenario } from "@/fixtures/demo/scenario";
import { evaluateProperty } from "@/lib/risk/evaluate";
import { recomputeAllIndexes } from "@/lib/scoring/store-index";

import { createDb, localDatabaseUrl } from "./client";
import { seedDemoPhotos } from "./seed-photos";
import { ensureDemoDay, removeCompany, seedCompany } from "./seed-scenario";

const isReset = process.argv.includes("--reset");
const db = createDb(process.env.DATABASE_URL ?? localDatabaseUrl("sward"), { max: 2 });
try {
  for (const company of demoScenario) {
    const existing = await db
      .selectFrom("companies")
      .select("id")
      .where("slug", "=", company.slug)
      .executeTakeFirst();
    if (existing && !isReset) {
      const stops = await ensureDemoDay(db, company);
      console.log(
        `seed: ${company.name} already present (use --reset to recreate it)${stops ? `; scheduled ${stops} stops for today` : ""}`,
      );
      continue;
    }
    if (existing) await removeCompany(db, company.slug);
    const seeded = await seedCompany(db, company, DEMO_PASSWORD);
    const photos = company.schedule
      ? await seedDemoPhotos(db, company.slug, process.env.PHOTO_DIR ?? ".data/photos")
      : 0;
    if (photos) await recomputeAllIndexes(db); // the demo photos are part of their checks' Index
    // Alerts from what the season recorded (the worker adds the weather-driven ones when it runs).
    let alerts = 0;
    for (const propertyId of Object.values(seeded.propertyIds))
      alerts += (await evaluateProperty(db, seeded.companyId, propertyId, { provider: null }))
        .raised;
    console.log(
      `seed: ${company.name}: ${company.people.length} sign-ins, ${Object.keys(seeded.propertyIds).length} properties, ${photos} photos, ${alerts} open alerts`,
    );
  }
} catch (err) {
  console.error("seed: failed:", err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
