// Sign-in links against the real database: only active homeowners get one, a token is used up the
// first time (also when opened twice at once), a tampered e-mail does not consume it, requests are
// counted per e-mail and per address, and the link e-mail goes out once even when the web process
// and the worker deliver at the same moment.
import { mkdtemp } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import {
  confirmationUrl,
  countRecentLinkRequests,
  hashedToken,
  issueSignInLink,
  queueSignInLink,
  recordLinkRequest,
  signInLinkAdapter,
} from "@/lib/auth/sign-in-link";
import { deliverPendingMail } from "@/lib/mail/outbox";
import { smtpMailer } from "@/lib/services/mail";

import { readInbox, startSmtpFake } from "../harness/smtp-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let c: TestCompany;
let dir = "";
let smtp: Awaited<ReturnType<typeof startSmtpFake>>;
const adapter = signInLinkAdapter as Required<typeof signInLinkAdapter>;
const SECRET = "integration-links-secret-0123456789abcdef";
const LINK =
  "http://localhost:3000/api/auth/callback/nodemailer?callbackUrl=%2Fmy-lawn&token=t&email=x";

/** Asks for a link as Auth.js does (sendVerificationRequest); answers the hash Auth.js looks up. */
async function issueLink(identifier: string, token: string, expires: Date): Promise<string> {
  await queueSignInLink({ identifier, url: LINK, token, expires, secret: SECRET });
  return hashedToken(token, SECRET);
}

beforeAll(async () => {
  c = await createTestCompany();
  dir = await mkdtemp(path.join(tmpdir(), "sward-links-"));
  smtp = await startSmtpFake(0, dir);
});
afterAll(async () => {
  await smtp.close();
});

describe("who can get a sign-in link", () => {
  it("an active homeowner, found by e-mail in any case", async () => {
    const user = await adapter.getUserByEmail(c.emails["owner1"]!.toUpperCase());
    expect(user).toMatchObject({ id: c.userIds["owner1"], email: c.emails["owner1"] });
  });
  it("not a technician or a manager (they keep their passwords), nor a disabled homeowner or a stranger", async () => {
    expect(await adapter.getUserByEmail(c.emails["tech1"]!)).toBeNull();
    expect(await adapter.getUserByEmail(c.emails["manager"]!)).toBeNull();
    expect(await adapter.getUserByEmail("nobody@nowhere.sward.test")).toBeNull();
    const other = await createTestCompany();
    await testDb()
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", other.userIds["owner3"]!)
      .execute();
    expect(await adapter.getUserByEmail(other.emails["owner3"]!)).toBeNull();
  });
  it("never creates an account", async () => {
    await expect(
      adapter.createUser({ id: "x", email: "new@sward.test", emailVerified: null }),
    ).rejects.toThrow(/does not create accounts/);
  });
});

describe("a link's token", () => {
  const identifier = () => c.emails["owner1"]!;
  it("works once: the second use — even at the same moment — finds nothing", async () => {
    const token = await issueLink(
      identifier(),
      `raw-${Date.now()}-a`,
      new Date(Date.now() + 15 * 60_000),
    );
    const uses = await Promise.all(
      Array.from({ length: 5 }, () =>
        adapter.useVerificationToken({ identifier: identifier(), token }),
      ),
    );
    expect(uses.filter(Boolean)).toHaveLength(1);
    expect(await adapter.useVerificationToken({ identifier: identifier(), token })).toBeNull();
    console.log(
      `sign-in links: 5 uses of one link at the same moment → ${uses.filter(Boolean).length} sign-in; a later use finds nothing`,
    );
  });
  it("used with another e-mail address it finds nothing and stays usable by its owner", async () => {
    const token = await issueLink(
      identifier(),
      `raw-${Date.now()}-b`,
      new Date(Date.now() + 15 * 60_000),
    );
    expect(
      await adapter.useVerificationToken({ identifier: c.emails["owner2"]!, token }),
    ).toBeNull();
    expect(await adapter.useVerificationToken({ identifier: identifier(), token })).toMatchObject({
      identifier: identifier(),
    });
  });
  it("comes back with its expiry, so Auth.js can refuse an expired one", async () => {
    const expires = new Date(Date.now() - 60_000);
    const token = await issueLink(identifier(), `raw-${Date.now()}-c`, expires);
    const used = await adapter.useVerificationToken({ identifier: identifier(), token });
    expect(used?.expires.getTime()).toBe(expires.getTime());
  });
});

describe("throttling link requests", () => {
  it("counts per e-mail address and per client address within the window", async () => {
    const email = `counted-${Date.now()}@sward.test`;
    await recordLinkRequest(email, "203.0.113.7");
    await recordLinkRequest(email, "203.0.113.8");
    await recordLinkRequest(`other-${email}`, "203.0.113.7");
    expect(await countRecentLinkRequests(email, "203.0.113.7", 15)).toEqual({
      forEmail: 2,
      fromAddress: 2,
    });
    await testDb()
      .updateTable("sign_in_link_requests")
      .set({ requested_at: new Date(Date.now() - 20 * 60_000) })
      .where("email_key", "=", email)
      .execute();
    expect(await countRecentLinkRequests(email, "203.0.113.7", 15)).toEqual({
      forEmail: 0,
      fromAddress: 1,
    });
  });
});

describe("the link's host", () => {
  it("is the configured app address, whatever host the request named (X-Forwarded-Host, Host)", () => {
    // What Auth.js builds when it trusts a forged X-Forwarded-Host: every part on evil.example.
    const forged =
      "http://evil.example/api/auth/callback/nodemailer?callbackUrl=http%3A%2F%2Fevil.example%2Fmy-lawn&token=abc123&email=owner%40x.test";
    const link = new URL(confirmationUrl(forged));
    expect(link.origin).toBe("http://localhost:3000"); // no AUTH_URL in this test run: localhost:$PORT
    expect(link.pathname).toBe("/sign-in/link");
    expect(link.searchParams.get("callbackUrl")).toBe("http://localhost:3000/my-lawn");
    expect(link.searchParams.get("token")).toBe("abc123");
    for (const asked of ["/\t/evil.example", "//evil.example/x", "https://evil.example/"]) {
      const u = new URL(
        confirmationUrl(
          `http://evil.example/x?${new URLSearchParams({ callbackUrl: asked, token: "t", email: "e" })}`,
        ),
      );
      expect(new URL(u.searchParams.get("callbackUrl")!).origin).toBe("http://localhost:3000");
    }
  });

  it("issueSignInLink writes a token and a message for a homeowner only, linking to the app address", async () => {
    const to = c.emails["owner3"]!;
    expect(await issueSignInLink("nobody-here@sward.test", "/my-lawn")).toBe(false);
    expect(await issueSignInLink(to, "/\t/evil.example")).toBe(true);
    const row = await testDb()
      .selectFrom("mail_outbox")
      .selectAll()
      .where("to_address", "=", to)
      .where("kind", "=", "sign_in_link")
      .executeTakeFirstOrThrow();
    const link = /https?:\/\/\S+/.exec(row.text_body)![0];
    expect(new URL(link).origin).toBe("http://localhost:3000");
    expect(new URL(new URL(link).searchParams.get("callbackUrl")!).pathname).toBe("/");
  });
});

describe("the link e-mail", () => {
  it("links to the confirmation page (not straight to the token check) and is delivered once with two deliverers racing", async () => {
    const callback =
      "http://localhost:3000/api/auth/callback/nodemailer?callbackUrl=%2Fmy-lawn&token=abc123&email=owner%40x.test";
    expect(confirmationUrl(callback)).toBe(
      "http://localhost:3000/sign-in/link?callbackUrl=http%3A%2F%2Flocalhost%3A3000%2Fmy-lawn&token=abc123&email=owner%40x.test",
    );

    const to = c.emails["owner2"]!;
    const expires = new Date(Date.now() + 15 * 60_000);
    const raw = `tok-${Date.now()}`;
    await queueSignInLink({
      identifier: to,
      url: callback.replace("owner%40x.test", encodeURIComponent(to)),
      token: raw,
      expires,
      secret: SECRET,
    });
    await queueSignInLink({
      identifier: "stranger@sward.test",
      url: callback,
      token: `tok-${Date.now()}-s`,
      expires,
      secret: SECRET,
    }); // no account: nothing queued, no token stored
    // The token row was written with its e-mail, hashed as Auth.js will look it up.
    const rows = await testDb()
      .selectFrom("verification_tokens")
      .select(["identifier", "token"])
      .where("token", "in", [hashedToken(raw, SECRET), hashedToken(`${raw}-s`, SECRET)])
      .execute();
    expect(rows).toEqual([{ identifier: to, token: hashedToken(raw, SECRET) }]);
    const mailer = smtpMailer(`smtp://127.0.0.1:${smtp.port}`);
    await Promise.all([
      deliverPendingMail(testDb(), mailer, 100, { kind: "sign_in_link" }),
      deliverPendingMail(testDb(), mailer, 100, { kind: "sign_in_link" }),
    ]);
    const mails = (await readInbox(dir)).filter((m) => m.to.includes(to));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.subject).toMatch(/^Your sign-in link for /);
    expect(mails[0]!.text).toMatch(/works once, within 15 minutes/);
    expect(mails[0]!.text).toContain("/sign-in/link?");
    expect((await readInbox(dir)).some((m) => m.to.includes("stranger@sward.test"))).toBe(false);
  });
});
