// Sign-in links for homeowners (Auth.js e-mail provider). Staff keep their passwords; only an
// active homeowner gets a link. A link works once (the token row is deleted as it is used) and
// for SIGN_IN_LINK_MINUTES; what travels in the e-mail is the token, what is stored is its hash
// (Auth.js hashes it with the secret). The token row and its e-mail (an outbox row) are written in
// one transaction. Requests are throttled in requestSignInLinkAction.
import "server-only";

import { createHash } from "node:crypto";
import type { Transaction } from "kysely";
import type { Adapter, AdapterUser } from "next-auth/adapters";

import type { Database } from "@/db/schema";
import { appUrl, serverEnv } from "@/lib/env";
import { sameOriginPath } from "@/lib/http/redirect";
import { signInLinkEmail } from "@/lib/mail/sign-in-email";

import type { Homeowner } from "./dto";
import {
  markEmailVerified,
  storeLinkToken,
  storeSignInLink,
  takeVerificationToken,
} from "./mutations";
import { findHomeowner as findHomeownerByKey, findUserById } from "./queries";
import { normaliseEmail } from "./throttle";
import { hashedToken, newLinkToken } from "./tokens";

export { recordLinkRequest } from "./mutations";
export { hashedToken } from "./tokens";
export { countRecentLinkRequests } from "./queries";

export const SIGN_IN_LINK_MINUTES = 15;
/**
 * How long the one-time link in a visit report e-mail signs its homeowner in. Longer than a link
 * asked for on the sign-in page (read within minutes) because a report is read when the e-mail is
 * opened, often the evening after the visit; the same single-use token, stored as its hash, and the
 * same confirmation step. Afterwards the report's plain address still works through sign-in.
 */
export const REPORT_LINK_HOURS = 72;
export const SIGN_IN_LINK_PROVIDER = "nodemailer";

export function findHomeowner(email: string): Promise<Homeowner | undefined> {
  return findHomeownerByKey(normaliseEmail(email));
}

const asAdapterUser = (h: Homeowner): AdapterUser => ({
  id: h.userId,
  email: h.email,
  name: h.name,
  emailVerified: h.emailVerified,
});

/** Just what the e-mail provider needs. Sward never creates an account at sign-in. */
export const signInLinkAdapter: Adapter = {
  // Auth.js calls this beside sendVerificationRequest; the row is written there instead, in the
  // transaction of its e-mail (queueSignInLink), so a token never exists without its message.
  async createVerificationToken(token) {
    return token;
  },
  async useVerificationToken({ identifier, token }) {
    if (!identifier || !token) return null;
    return (await takeVerificationToken(identifier, token)) ?? null;
  },
  async getUserByEmail(email) {
    const h = await findHomeowner(email);
    return h ? asAdapterUser(h) : null;
  },
  async getUser(id) {
    return (await findUserById(id)) ?? null;
  },
  async updateUser(user) {
    return markEmailVerified(user.id, user.emailVerified);
  },
  async createUser() {
    throw new Error("Sward does not create accounts at sign-in.");
  },
};

/**
 * The e-mail links to our confirmation page, which sends the homeowner on to Auth.js's callback
 * with one tap (mail scanners that open links do not use up the token). Only the token, the
 * address and a same-origin path are taken from `callbackUrl`; the host is always the configured
 * app address (AUTH_URL), never one a request named in Host or X-Forwarded-Host.
 */
export function confirmationUrl(callbackUrl: string): string {
  const from = new URL(callbackUrl).searchParams;
  const origin = appUrl();
  let next = "/";
  const asked = from.get("callbackUrl");
  if (asked) {
    try {
      const u = new URL(asked, origin);
      next = sameOriginPath(`${u.pathname}${u.search}${u.hash}`) ?? "/";
    } catch {
      next = "/";
    }
  }
  const query = new URLSearchParams({
    callbackUrl: `${origin}${next}`,
    token: from.get("token") ?? "",
    email: from.get("email") ?? "",
  });
  return `${origin}/sign-in/link?${query.toString()}`;
}

/** Auth.js's e-mail callback for a token, sending the person on to `path` (same origin only). */
function callbackFor(emailKey: string, token: string, path: string): string {
  const origin = appUrl();
  const callback = new URL(`${origin}/api/auth/callback/${SIGN_IN_LINK_PROVIDER}`);
  callback.search = new URLSearchParams({
    callbackUrl: `${origin}${sameOriginPath(path) ?? "/"}`,
    token,
    email: emailKey,
  }).toString();
  return callback.toString();
}

/**
 * The one-time sign-in link of a visit report e-mail, made inside the transaction that queues the
 * e-mail (so a token never exists without its message): it opens `path` (the report) signed in,
 * once, within REPORT_LINK_HOURS.
 */
export async function reportSignInLink(
  trx: Transaction<Database>,
  email: string,
  path: string,
): Promise<string> {
  const emailKey = normaliseEmail(email);
  const token = newLinkToken();
  await storeLinkToken(trx, {
    identifier: emailKey,
    token: hashedToken(token, serverEnv().AUTH_SECRET),
    expires: new Date(Date.now() + REPORT_LINK_HOURS * 3_600_000),
  });
  return confirmationUrl(callbackFor(emailKey, token, path));
}

/**
 * Issues a sign-in link for an e-mail address when it belongs to an active homeowner, and does
 * nothing otherwise. Runs after the response has been sent (requestSignInLinkAction), so the
 * answer takes the same time whoever the address belongs to. The token is made as Auth.js makes
 * one (32 random bytes, hex) and checked by Auth.js's own callback.
 */
export async function issueSignInLink(emailKey: string, redirectTo: string): Promise<boolean> {
  if (!(await findHomeowner(emailKey))) return false;
  const token = newLinkToken();
  await queueSignInLink({
    identifier: emailKey,
    url: callbackFor(emailKey, token, redirectTo),
    token,
    expires: new Date(Date.now() + SIGN_IN_LINK_MINUTES * 60_000),
    secret: serverEnv().AUTH_SECRET,
  });
  return true;
}

/**
 * The provider's sendVerificationRequest: the token row (hashed as Auth.js checks it) and the
 * message in the outbox, in one transaction (delivered right after the response, retried by the
 * worker).
 */
export async function queueSignInLink(params: {
  identifier: string;
  url: string;
  token: string;
  expires: Date;
  secret: string;
}): Promise<void> {
  const h = await findHomeowner(params.identifier);
  if (!h) return; // the signIn callback refuses these before a token is made
  const mail = signInLinkEmail({
    link: confirmationUrl(params.url),
    minutes: SIGN_IN_LINK_MINUTES,
    companyName: h.companyName,
    name: h.name,
    locale: h.companyLocale,
  });
  const key = createHash("sha256").update(params.token).digest("hex").slice(0, 40);
  await storeSignInLink(
    {
      identifier: params.identifier,
      token: hashedToken(params.token, params.secret),
      expires: params.expires,
    },
    {
      companyId: h.companyId,
      kind: "sign_in_link",
      dedupeKey: `sign_in_link:${key}`,
      to: h.email,
      ...mail,
    },
  );
}
