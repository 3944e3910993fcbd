// A web process is killed (SIGKILL) right after a visit's finish commits, before any delivery:
// the homeowner's report e-mail was committed with the finish (an outbox row), and the worker and
// a restarted web process, delivering at the same moment, send it exactly once.
import { spawn } from "node:child_process";
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { deliverPendingMail } from "@/lib/mail/outbox";
import { smtpMailer } from "@/lib/services/mail";
import { saveZoneCheck, startVisit } from "@/lib/visits/mutations";

import { readInbox, startSmtpFake } from "../harness/smtp-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let c: TestCompany;
let dir = "";
let smtp: Awaited<ReturnType<typeof startSmtpFake>>;

beforeAll(async () => {
  c = await createTestCompany();
  dir = await mkdtemp(path.join(tmpdir(), "sward-crash-mail-"));
  smtp = await startSmtpFake(0, dir);
});
afterAll(async () => {
  await smtp.close();
});

function finishThenDie(visitId: string, actor: unknown): Promise<NodeJS.Signals | null> {
  return new Promise((resolve, reject) => {
    const child = spawn(
      process.execPath,
      ["--conditions=react-server", "--import", "tsx", "tests/helpers/finish-then-die.ts", visitId],
      { env: { ...process.env, SWARD_ACTOR: JSON.stringify(actor) }, stdio: "inherit" },
    );
    child.on("error", reject);
    child.on("exit", (_code, signal) => resolve(signal));
  });
}

describe("a crash right after a finish", () => {
  it("loses no report e-mail and sends none twice", async () => {
    const tech1 = await c.actor("tech1");
    const propertyId = c.propertyIds["haddad"]!;
    const visit = await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", propertyId)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow();
    await startVisit(tech1, visit.id, { latitude: null, longitude: null });
    const zones = await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", propertyId)
      .where("archived_at", "is", null)
      .execute();
    for (const z of zones) await saveZoneCheck(tech1, visit.id, newId(), doneCheck(z.id));

    expect(await finishThenDie(visit.id, tech1)).toBe("SIGKILL");

    const finished = await testDb()
      .selectFrom("visits")
      .select("status")
      .where("id", "=", visit.id)
      .executeTakeFirstOrThrow();
    expect(finished.status).toBe("completed");
    const rows = await testDb()
      .selectFrom("mail_outbox")
      .select(["status", "to_address"])
      .where("dedupe_key", "like", `visit_report:${visit.id}:%`)
      .execute();
    expect(rows).toEqual([{ status: "pending", to_address: c.emails["owner2"] }]);

    // The worker's minute run and the restarted web process's nudge, at the same moment.
    const mailer = smtpMailer(`smtp://127.0.0.1:${smtp.port}`);
    await Promise.all([
      deliverPendingMail(testDb(), mailer, 100, { kind: "visit_report" }),
      deliverPendingMail(testDb(), mailer, 100, { kind: "visit_report" }),
    ]);
    await deliverPendingMail(testDb(), mailer, 100, { kind: "visit_report" });
    const mails = (await readInbox(dir)).filter((m) => m.html.includes(visit.id));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.to).toEqual([c.emails["owner2"]]);
    console.log(
      `crash after finish: outbox rows committed with the finish 1, delivered after the kill ${mails.length}`,
    );
  }, 60_000);
});
