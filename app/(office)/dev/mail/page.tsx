import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Fragment } from "react";

import { requireActor } from "@/lib/auth/require";
import { formatDateTime } from "@/lib/dates";
import { devInboxDir } from "@/lib/env";
import { invitationSubject, staffInvitationSubject } from "@/lib/invitations/email";
import { listInvitedAddresses } from "@/lib/invitations/queries";
import { readInbox } from "@/lib/mail/inbox-folder";
import { listCompanyEmailAddresses } from "@/lib/people/queries";

export const metadata: Metadata = { title: "Development inbox" };

const URL_PATTERN = /(https?:\/\/[^\s<>"]+)/g;

/** Plain text with its web addresses as links (React elements, never HTML from the message). */
function Linkified({ text }: { text: string }) {
  return text.split(URL_PATTERN).map((part, i) =>
    i % 2 === 1 ? (
      <a key={i} href={part} className="break-all text-sward underline">
        {part}
      </a>
    ) : (
      <Fragment key={i}>{part}</Fragment>
    ),
  );
}

// Development only: what the local fake SMTP service received, for this company's people. The page
// exists only where MAIL_INBOX_DIR is set (the demo and the e2e suite set it), and lib/env.ts
// refuses that setting unless AUTH_URL is a loopback address: a deployment others can reach never
// shows anyone's live sign-in links.
export default async function DevMailPage({
  searchParams,
}: {
  searchParams: Promise<{ id?: string }>;
}) {
  const actor = await requireActor(["manager"]);
  const dir = devInboxDir();
  if (!dir) notFound();
  const [ours, invited] = await Promise.all([
    listCompanyEmailAddresses(actor),
    listInvitedAddresses(actor),
  ]);
  // An invited address may belong to someone of another company: of its mail, only this
  // company's own invitations are shown.
  const ourInvitations = new Set([
    invitationSubject(actor.companyName, actor.companyLocale),
    staffInvitationSubject(actor.companyName, actor.companyLocale),
  ]);
  const mails = (await readInbox(dir))
    .filter((m) =>
      m.to.some(
        (t) =>
          ours.has(t.toLowerCase()) ||
          (invited.has(t.toLowerCase()) && ourInvitations.has(m.subject)),
      ),
    )
    .reverse()
    .slice(0, 100);
  const { id } = await searchParams;
  const open = mails.find((m) => m.id === id) ?? mails[0];

  return (
    <>
      <h1 className="text-3xl font-bold">Development inbox</h1>
      <p className="mt-1 mb-6 max-w-2xl text-muted">
        Mail Sward sent to your company&apos;s people, as the local fake SMTP service received it —
        sign-in links, visit reports, alert digests, and the invitations it sent. This page exists
        only in development (MAIL_INBOX_DIR is set); a real deployment sends through a real mail
        service.
      </p>
      {mails.length === 0 ? (
        <p className="rounded-xl border border-line bg-card p-4">
          No mail yet. Finish a visit, or ask for a sign-in link as a homeowner.
        </p>
      ) : (
        <div className="grid gap-6 lg:grid-cols-[22rem_1fr]">
          <ol
            aria-label="Messages, newest first"
            className="divide-y divide-line self-start overflow-hidden rounded-xl border border-line bg-card"
          >
            {mails.map((m) => (
              <li key={m.id}>
                <Link
                  href={`/dev/mail?id=${encodeURIComponent(m.id)}`}
                  aria-current={m.id === open?.id ? "true" : undefined}
                  className={`block p-3 no-underline hover:bg-sward-tint ${m.id === open?.id ? "bg-sward-tint" : ""}`}
                >
                  <span className="block font-semibold text-ink">
                    {m.subject || "(no subject)"}
                  </span>
                  <span className="block text-sm text-muted">
                    to {m.to.join(", ")} · {formatDateTime(m.receivedAt, actor.companyTimeZone)}
                  </span>
                </Link>
              </li>
            ))}
          </ol>
          {open ? (
            <article
              aria-labelledby="mail-subject"
              className="min-w-0 rounded-xl border border-line bg-card p-4"
            >
              <h2 id="mail-subject" className="text-xl font-bold">
                {open.subject}
              </h2>
              <dl className="mt-2 mb-4 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
                <dt className="text-muted">From</dt>
                <dd>{open.from}</dd>
                <dt className="text-muted">To</dt>
                <dd>{open.to.join(", ")}</dd>
                <dt className="text-muted">Received</dt>
                <dd>{formatDateTime(open.receivedAt, actor.companyTimeZone)}</dd>
              </dl>
              <h3 className="font-semibold">Plain text</h3>
              <pre className="mt-1 rounded-lg bg-paper p-3 font-sans text-base break-words whitespace-pre-wrap">
                <Linkified text={open.text} />
              </pre>
              {open.html ? (
                <>
                  <h3 className="mt-4 font-semibold">As HTML (scripts and forms disabled)</h3>
                  <iframe
                    title={`HTML of “${open.subject}”`}
                    sandbox="allow-popups allow-popups-to-escape-sandbox"
                    srcDoc={open.html}
                    className="mt-1 h-[32rem] w-full rounded-lg border border-line bg-white"
                  />
                </>
              ) : null}
            </article>
          ) : null}
        </div>
      )}
    </>
  );
}
