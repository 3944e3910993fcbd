// The weather cache keeps each day's hours (temperature and relative humidity, local time, as
// Open-Meteo gives them) for the Pythium blight model, and the service's own daily FAO-56
// reference ET as an outside check of ours. Rows cached before this have neither; the cache asks
// the service again for a recent day without its hours (lib/weather/cache.ts). Frozen: never
// import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table weather_days add column hourly jsonb`.execute(db);
  await sql`alter table weather_days add column service_et0_mm real check (service_et0_mm >= 0)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table weather_days drop column service_et0_mm`.execute(db);
  await sql`alter table weather_days drop column hourly`.execute(db);
}
