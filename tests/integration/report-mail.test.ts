// The report e-mail: finishing a visit queues one message per homeowner in the outbox (finishing
// again queues nothing); the worker's delivery sends it through SMTP; with SMTP down the message
// waits and, once the service is back, exactly one copy arrives.
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { REPORT_LINK_HOURS } from "@/lib/auth/sign-in-link";
import { hashedToken } from "@/lib/auth/tokens";
import { deliverPendingMail } from "@/lib/mail/outbox";
import { finishVisit } from "@/lib/reports/mutations";
import { smtpMailer } from "@/lib/services/mail";
import { saveZoneCheck, startVisit } from "@/lib/visits/mutations";

import { readInbox, startSmtpFake } from "../harness/smtp-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let c: TestCompany;
let dir = "";
let smtp: Awaited<ReturnType<typeof startSmtpFake>>;
const ours = async () => (await readInbox(dir)).filter((m) => m.to.includes(c.emails["owner2"]!));
const outbox = () =>
  testDb().selectFrom("mail_outbox").selectAll().where("company_id", "=", c.companyId).execute();

beforeAll(async () => {
  c = await createTestCompany();
  dir = await mkdtemp(path.join(tmpdir(), "sward-report-mail-"));
  smtp = await startSmtpFake(0, dir);
});
afterAll(async () => {
  await smtp.close();
});

describe("the visit report e-mail", () => {
  it("SMTP down during completion: the e-mail waits in the outbox and is sent once the service returns — exactly one copy", async () => {
    const tech1 = await c.actor("tech1");
    const visit = await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow();
    await startVisit(tech1, visit.id, { latitude: null, longitude: null });
    const zones = await testDb()
      .selectFrom("zones")
      .select(["id", "name"])
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .execute();
    for (const z of zones)
      await saveZoneCheck(
        tech1,
        visit.id,
        newId(),
        doneCheck(z.id, { mowingDirection: "same", isMatted: z.name === "Front slope" }),
      );
    await finishVisit(tech1, visit.id);
    await finishVisit(tech1, visit.id); // finishing twice queues nothing more

    const queued = await outbox();
    expect(queued).toHaveLength(1);
    expect(queued[0]).toMatchObject({
      kind: "visit_report",
      to_address: c.emails["owner2"],
      status: "pending",
    });
    expect(queued[0]!.subject).toMatch(/^Your lawn visit report — Haddad residence, /);
    expect(queued[0]!.text_body).toMatch(/Change the mowing direction every few mowings/);
    expect(queued[0]!.html_body).toContain(`/my-lawn/reports/${visit.id}`);
    // The button is a one-time sign-in link to the report, made in the finish's transaction: its
    // token is stored only as a hash, for this homeowner, expiring in REPORT_LINK_HOURS.
    const signed = /https?:\/\/\S+\/sign-in\/link\?\S+/.exec(queued[0]!.text_body)?.[0] ?? "";
    const params = new URL(signed).searchParams;
    expect(new URL(params.get("callbackUrl")!).pathname).toBe(`/my-lawn/reports/${visit.id}`);
    expect(params.get("email")).toBe(c.emails["owner2"]);
    const token = params.get("token")!;
    expect(token).toMatch(/^[0-9a-f]{64}$/);
    const rows = await testDb()
      .selectFrom("verification_tokens")
      .selectAll()
      .where("identifier", "=", c.emails["owner2"]!)
      .execute();
    expect(rows.map((r) => r.token)).toContain(hashedToken(token, process.env.AUTH_SECRET!));
    expect(rows.map((r) => r.token)).not.toContain(token);
    const row = rows.find((r) => r.token === hashedToken(token, process.env.AUTH_SECRET!))!;
    const hoursLeft = (new Date(row.expires).getTime() - Date.now()) / 3_600_000;
    expect(hoursLeft).toBeGreaterThan(REPORT_LINK_HOURS - 1);
    expect(hoursLeft).toBeLessThanOrEqual(REPORT_LINK_HOURS);
    expect(queued[0]!.html_body).toContain(`href="${signed.replaceAll("&", "&amp;")}"`);

    // The SMTP service is down: delivery fails and the message stays pending.
    const port = smtp.port;
    await smtp.close();
    const mailer = smtpMailer(`smtp://127.0.0.1:${port}`);
    await expect(deliverPendingMail(testDb(), mailer)).rejects.toThrow();
    expect((await outbox())[0]).toMatchObject({ status: "pending" }); // (the oldest pending message, maybe another test's, took the failed attempt)

    smtp = await startSmtpFake(port, dir);
    // Each failed row waits out its back-off; here the wait has passed.
    await testDb()
      .updateTable("mail_outbox")
      .set({ next_attempt_at: new Date() })
      .where("status", "=", "pending")
      .execute();
    expect((await deliverPendingMail(testDb(), mailer)).sent).toBeGreaterThanOrEqual(1);
    await deliverPendingMail(testDb(), mailer);
    const mails = await ours();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/Haddad residence/);
    expect(mails[0]!.html).toContain("Read your visit report");
    expect((await outbox())[0]).toMatchObject({ status: "sent" });
  });
});
