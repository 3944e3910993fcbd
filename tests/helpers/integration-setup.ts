// Integration suite: a freshly created and migrated database (sward_test) on the local cluster.
// PostgreSQL is started when it is not running, and then stopped again by the teardown; the
// watchdog of tests/harness/supervisor.ts stops it if vitest ends without one.
import { Supervisor } from "../harness/supervisor";
import { TSX } from "./processes";

export default async function setup(): Promise<() => Promise<void>> {
  const sup = new Supervisor("integration setup", false);
  try {
    await sup.cluster();
    await sup.step("database", TSX, ["db/ensure-database.ts", "sward_test", "--fresh"]);
    const url = `postgres://postgres@127.0.0.1:${process.env.SWARD_PG_PORT ?? "54329"}/sward_test`;
    await sup.step("migrate", TSX, ["db/migrate.ts"], { env: { DATABASE_URL: url } });
  } catch (err) {
    await sup.stop();
    throw err;
  }
  return () => sup.stop();
}
