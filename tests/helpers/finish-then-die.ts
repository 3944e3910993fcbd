// A web process that dies right after a visit's finish commits: finishes the visit through the
// same function the route handler calls, then SIGKILLs itself before any mail is delivered.
// `node --conditions=react-server --import tsx tests/helpers/finish-then-die.ts <visitId>` with
// the actor as JSON in SWARD_ACTOR (spawned by tests/integration/report-mail-crash.test.ts).
import type { Actor } from "@/lib/auth/actor";
import { finishVisit } from "@/lib/reports/mutations";

const actor = JSON.parse(process.env.SWARD_ACTOR!) as Actor;
await finishVisit(actor, process.argv[2]!);
process.kill(process.pid, "SIGKILL");
