// The managers' digest of new high-severity alerts: outbox rows (one per manager) written with the
// alerts marked notified, delivered through nodemailer to the local fake SMTP service; nothing
// queued twice; an SMTP outage delays the digest (the rows stay pending, the delivery fails so the
// job retries) and, once the service is back, exactly one copy arrives.
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { evaluateProperty } from "@/lib/after-write/sweep";
import { deliverPendingMail } from "@/lib/mail/outbox";
import { queueHighAlertDigests } from "@/lib/risk-alerts/digest";
import { smtpMailer } from "@/lib/services/mail";

import { readInbox, startSmtpFake } from "../harness/smtp-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let c: TestCompany;
let dir = "";
let smtp: Awaited<ReturnType<typeof startSmtpFake>>;
const ours = async () => (await readInbox(dir)).filter((m) => m.to.includes(c.emails["manager"]!));

beforeAll(async () => {
  c = await createTestCompany();
  for (const id of Object.values(c.propertyIds))
    await evaluateProperty(testDb(), c.companyId, id, { provider: null });
  dir = await mkdtemp(path.join(tmpdir(), "sward-mail-"));
  smtp = await startSmtpFake(0, dir);
});
afterAll(async () => {
  await smtp.close();
});

describe("high-severity alert digest", () => {
  it("sends one message to the company's managers listing each new high alert, and never twice", async () => {
    const mailer = smtpMailer(`smtp://127.0.0.1:${smtp.port}`);
    const queued = await queueHighAlertDigests(testDb(), {
      appUrl: "http://localhost:3000",
      companyIds: [c.companyId],
    });
    expect(queued).toMatchObject({ alerts: 2 });
    await deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" });
    const mails = await ours();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/^2 new high-severity alerts in Larkmoor Lawn Care/);
    expect(mails[0]!.text).toMatch(/Declining Index — Haddad residence, Larkfield \(Back yard\)/);
    expect(mails[0]!.text).toMatch(
      /Declining Index — Kowalczyk residence, Cedar Ford \(Under the oaks\)/,
    );
    expect(mails[0]!.text).not.toMatch(/Torn tips/); // low severity: not in the digest
    expect(mails[0]!.html).toContain('href="http://localhost:3000/risk-alerts?severity=high"');
    expect(
      await queueHighAlertDigests(testDb(), {
        appUrl: "http://localhost:3000",
        companyIds: [c.companyId],
      }),
    ).toEqual({
      messages: 0,
      alerts: 0,
    });
    await deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" });
    expect(await ours()).toHaveLength(1);
  });

  it("SMTP down: the digest waits in the outbox; back up: exactly one copy", async () => {
    const alert = await testDb()
      .selectFrom("risk_alerts")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("severity", "=", "high")
      .executeTakeFirstOrThrow();
    await testDb()
      .updateTable("risk_alerts")
      .set({ notified_at: null })
      .where("id", "=", alert.id)
      .execute(); // as if newly raised
    const port = smtp.port;
    await smtp.close();
    const mailer = smtpMailer(`smtp://127.0.0.1:${port}`);
    await queueHighAlertDigests(testDb(), {
      appUrl: "http://localhost:3000",
      companyIds: [c.companyId],
    });
    await expect(
      deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" }),
    ).rejects.toThrow();
    const pending = await testDb()
      .selectFrom("mail_outbox")
      .select(["id", "status", "attempts", "next_attempt_at"])
      .where("company_id", "=", c.companyId)
      .where("kind", "=", "alert_digest")
      .where("status", "=", "pending")
      .where("to_address", "=", c.emails["manager"]!)
      .execute();
    expect(pending).toHaveLength(1);
    expect(pending[0]!.attempts).toBeLessThanOrEqual(1); // the first pending row took the failed try
    const tried = await testDb()
      .selectFrom("mail_outbox")
      .select(["attempts", "next_attempt_at", "last_error"])
      .where("company_id", "=", c.companyId)
      .where("kind", "=", "alert_digest")
      .where("attempts", ">", 0)
      .where("status", "=", "pending")
      .executeTakeFirstOrThrow();
    expect(tried.next_attempt_at.getTime()).toBeGreaterThan(Date.now()); // backing off
    expect(tried.last_error).toBeTruthy();
    smtp = await startSmtpFake(port, dir);
    // The failed row is not tried again before its back-off has passed (the others go out).
    await deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" });
    expect(
      await testDb()
        .selectFrom("mail_outbox")
        .select("status")
        .where("company_id", "=", c.companyId)
        .where("kind", "=", "alert_digest")
        .where("attempts", ">", 0)
        .where("status", "=", "pending")
        .execute(),
    ).toHaveLength(1);
    await testDb()
      .updateTable("mail_outbox")
      .set({ next_attempt_at: new Date() })
      .where("company_id", "=", c.companyId)
      .where("status", "=", "pending")
      .execute(); // the back-off has passed
    await deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" });
    await deliverPendingMail(testDb(), mailer, 100, { kind: "alert_digest" });
    const mails = await ours();
    expect(mails).toHaveLength(2);
    expect(mails[1]!.subject).toMatch(/^1 new high-severity alert in/);
  });
});
