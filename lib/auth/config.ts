// next-auth (Auth.js v5): e-mail + password for everyone, and e-mailed sign-in links for
// homeowners (lib/auth/sign-in-link.ts), with the JWT session strategy. Each JWT carries the id
// of a row in auth_sessions; sign-out deletes that row, so an old token can do nothing.
import "server-only";

import NextAuth, { CredentialsSignin } from "next-auth";
import Credentials from "next-auth/providers/credentials";
import Nodemailer from "next-auth/providers/nodemailer";

import { authRedirect } from "@/lib/http/redirect";
import { log } from "@/lib/log";
import { MAIL_FROM } from "@/lib/services/mail";

import { checkCredentials } from "./credentials";
import { createAuthSession, deleteAuthSession } from "./mutations";
import { signInSchema } from "./schemas";
import {
  findHomeowner,
  queueSignInLink,
  SIGN_IN_LINK_MINUTES,
  signInLinkAdapter,
} from "./sign-in-link";

const SESSION_MAX_AGE_SECONDS = 14 * 24 * 60 * 60;

class InvalidCredentials extends CredentialsSignin {
  code = "invalid";
}
class ThrottledSignIn extends CredentialsSignin {
  code = "throttled";
}

// The client address. The production server starts with lib/http/edge-address.mjs, which leaves
// exactly one entry in x-forwarded-for: the socket's peer, or the entry TRUSTED_PROXY_COUNT hops
// from the right behind proxies (instrumentation.ts refuses to serve without it). Without it
// (next dev, tests calling handlers in-process) the right-most entry is read.
export function clientAddress(headers: Headers): string {
  const hops = headers.get("x-forwarded-for")?.split(",") ?? [];
  return hops.at(-1)?.trim() || "unknown";
}

export const { handlers, signIn, signOut } = NextAuth({
  trustHost: true,
  // A refused sign-in is routine: one line at info level, no stack. Real failures go to error.
  logger: {
    error(error) {
      if (error instanceof CredentialsSignin) log.info({ code: error.code }, "sign-in refused");
      else log.error({ err: error }, "auth error");
    },
    warn(code) {
      log.warn({ code }, "auth warning");
    },
    debug() {},
  },
  session: { strategy: "jwt", maxAge: SESSION_MAX_AGE_SECONDS },
  pages: { signIn: "/sign-in", error: "/sign-in", verifyRequest: "/sign-in?sent=1" },
  adapter: signInLinkAdapter,
  providers: [
    Nodemailer({
      // Delivery goes through Sward's outbox (queueSignInLink); nodemailer sends it from there.
      server: process.env.SMTP_URL ?? "smtp://127.0.0.1:25",
      from: MAIL_FROM,
      maxAge: SIGN_IN_LINK_MINUTES * 60,
      // The secret Auth.js hashes a link's token with (it prefers the provider's own), named here
      // so the token row written with the e-mail carries the same hash.
      secret: process.env.AUTH_SECRET,
      sendVerificationRequest: ({ identifier, url, token, expires, provider }) => {
        if (!provider.secret) throw new Error("AUTH_SECRET is not set");
        return queueSignInLink({ identifier, url, token, expires, secret: provider.secret });
      },
    }),
    Credentials({
      credentials: { email: { type: "email" }, password: { type: "password" } },
      async authorize(raw, request) {
        const parsed = signInSchema.safeParse(raw);
        if (!parsed.success) throw new InvalidCredentials();
        const result = await checkCredentials({
          ...parsed.data,
          address: clientAddress(request.headers),
        });
        if (!result.ok)
          throw result.reason === "throttled" ? new ThrottledSignIn() : new InvalidCredentials();
        return { id: result.userId };
      },
    }),
  ],
  callbacks: {
    // Every redirect Auth.js makes (callbackUrl from a form, a link or its cookie) passes the one
    // same-origin check (lib/http/redirect.ts); its default let "/\t/host" through.
    redirect: authRedirect,
    // Links are for active homeowners only: checked when a link is asked for and again when it is used.
    async signIn({ account, user }) {
      if (account?.type !== "email") return true;
      return Boolean(user.email && (await findHomeowner(user.email)));
    },
    async jwt({ token, user }) {
      if (user?.id) {
        token.sub = user.id;
        token.sid = await createAuthSession(user.id, SESSION_MAX_AGE_SECONDS);
      }
      return token;
    },
    async session({ session, token }) {
      // Only the opaque session id travels; who the user is and what they may do is read
      // from the database on every request (lib/auth/session.ts).
      return {
        expires: session.expires,
        sessionId: typeof token.sid === "string" ? token.sid : undefined,
      } as unknown as typeof session;
    },
  },
  events: {
    signIn({ user, account }) {
      if (account?.type === "email")
        log.info(
          { event: "sign_in", method: "link", userId: user.id },
          "signed in with an e-mailed link",
        );
    },
    async signOut(message) {
      const sid = "token" in message ? message.token?.sid : undefined;
      if (typeof sid === "string") await deleteAuthSession(sid);
    },
  },
});
