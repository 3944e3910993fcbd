// The managers' digest of new high-severity alerts through nodemailer to the local fake SMTP
// service: one message per company with each alert; nothing sent twice; an SMTP outage delays the
// digest (the alerts stay un-notified and the call fails, so the job retries) and, once the
// service is back, exactly one copy arrives.
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { evaluateProperty } from "@/lib/after-write/sweep";
import { sendHighAlertDigests } from "@/lib/risk-alerts/digest";
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
    await sendHighAlertDigests(testDb(), mailer, { appUrl: "http://localhost:3000" });
    const mails = await ours();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/^2 new high-severity alerts in Larkmoor Lawn Care/);
    expect(mails[0]!.text).toMatch(/Declining Index — Haddad residence, Larkfield \(Back yard\)/);
    expect(mails[0]!.text).toMatch(
      /Declining Index — Kowalczyk residence, Cedar Ford \(Under the oaks\)/,
    );
    expect(mails[0]!.text).not.toMatch(/Torn tips/); // low severity: not in the digest
    expect(mails[0]!.html).toContain('href="http://localhost:3000/risk-alerts?severity=high"');
    await sendHighAlertDigests(testDb(), mailer, { appUrl: "http://localhost:3000" });
    expect(await ours()).toHaveLength(1);
  });

  it("SMTP down: the digest fails and keeps the alert pending; back up: exactly one copy", async () => {
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
    await expect(
      sendHighAlertDigests(testDb(), mailer, { appUrl: "http://localhost:3000" }),
    ).rejects.toThrow();
    expect(
      (
        await testDb()
          .selectFrom("risk_alerts")
          .select("notified_at")
          .where("id", "=", alert.id)
          .executeTakeFirstOrThrow()
      ).notified_at,
    ).toBeNull();
    smtp = await startSmtpFake(port, dir);
    await sendHighAlertDigests(testDb(), mailer, { appUrl: "http://localhost:3000" });
    await sendHighAlertDigests(testDb(), mailer, { appUrl: "http://localhost:3000" });
    const mails = await ours();
    expect(mails).toHaveLength(2);
    expect(mails[1]!.subject).toMatch(/^1 new high-severity alert in/);
  });
});
