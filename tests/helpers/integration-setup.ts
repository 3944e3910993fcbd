// Integration suite: a freshly created and migrated database (sward_test) on the local cluster.
import { run, TSX } from "./processes";

export default async function setup(): Promise<void> {
  await run("sh", ["db/cluster.sh", "start"]);
  await run(TSX, ["db/ensure-database.ts", "sward_test", "--fresh"]);
  const url = `postgres://postgres@127.0.0.1:${process.env.SWARD_PG_PORT ?? "54329"}/sward_test`;
  await run(TSX, ["db/migrate.ts"], { DATABASE_URL: url });
}
