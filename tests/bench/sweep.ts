// The daily risk sweep over the benchmark book, as the worker runs it; prints one JSON line with
// its wall time and this process's peak resident memory. Used by `npm run bench`.
import { createDb } from "@/db/client";
import { sweepBook } from "@/lib/after-write/sweep";

const db = createDb(process.env.DATABASE_URL!, { max: 3 });
const result = await sweepBook(db, null);
await db.destroy();
console.log(JSON.stringify({ ...result, maxRssMb: process.resourceUsage().maxRSS / 1024 }));
