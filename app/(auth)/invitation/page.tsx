import type { Metadata } from "next";
import Link from "next/link";

import { AcceptInvitationForm } from "@/components/invitations/accept-invitation-form";
import { SwardMark } from "@/components/ui/sward-mark";
import { MIN_PASSWORD_LENGTH } from "@/lib/auth/password";
import { formatDateTime } from "@/lib/dates";
import { viewInvitation } from "@/lib/invitations/queries";
import { INVITATION_DAYS } from "@/lib/invitations/rules";

export const metadata: Metadata = { title: "Invitation", referrer: "no-referrer" };

// Where an invitation e-mail's link lands. Opening the page (as mail scanners do) uses nothing up:
// only the button does. What it says about the address's account is shown only to whoever holds
// the link sent to that address.
export default async function InvitationPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string | string[] }>;
}) {
  const { token } = await searchParams;
  const view = await viewInvitation(typeof token === "string" ? token : "");

  let title: string;
  let body: React.ReactNode;
  if (view.state === "pending") {
    const isStaff = view.role !== "homeowner";
    title = isStaff
      ? `${view.companyName} invites you to join its team`
      : `${view.companyName} invites you`;
    body = (
      <>
        {isStaff ? (
          <p className="mb-4">
            You are invited as{" "}
            <strong>{view.role === "manager" ? "a manager" : "a technician"}</strong>
            {view.role === "manager"
              ? ": the book of properties, the visits, the people and the records."
              : ": your stops of the day, zone checks and applications."}
          </p>
        ) : (
          <p className="mb-4">
            Follow the lawn at <strong>{view.street}</strong>, {view.city}: what each visit found,
            what was applied and why, and what to do between visits.
          </p>
        )}
        <p className="mb-5 text-muted">
          For <strong className="break-words text-ink">{view.email}</strong> · this link works until{" "}
          {formatDateTime(view.expiresAt, view.timeZone)}.
        </p>
        {view.account === "unavailable" ? (
          <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-3 text-clay">
            {isStaff
              ? "This e-mail address already has a Sward account, so this invitation cannot make another."
              : "This e-mail address already has a Sward account that cannot be added to this property."}{" "}
            Ask {view.companyName} to invite another address.
          </p>
        ) : (
          <>
            {view.account === "homeowner" ? (
              <p className="mb-5">
                You already have an account: accepting adds this property to it. You may be asked to
                sign in.
              </p>
            ) : (
              <p className="mb-5">Set a password to create your account.</p>
            )}
            <AcceptInvitationForm
              token={token as string}
              name={view.name}
              isNewAccount={view.account === "new"}
              minPasswordLength={MIN_PASSWORD_LENGTH}
            />
          </>
        )}
      </>
    );
  } else {
    title = "This invitation link no longer works";
    const why =
      view.state === "accepted"
        ? "It has been accepted already."
        : view.state === "revoked"
          ? "It was withdrawn."
          : view.state === "expired"
            ? `It expired: a link works for ${INVITATION_DAYS} days.`
            : "It is incomplete, or a newer link replaced it.";
    body = (
      <>
        <p className="mb-4">
          {why}{" "}
          {view.state === "unknown"
            ? "Open the latest invitation e-mail, or ask your lawn-care company to send it again."
            : `Ask ${view.companyName} to send it again if you still need it.`}
        </p>
        <p>
          Already have an account?{" "}
          <Link href="/sign-in" className="font-semibold text-sward underline">
            Sign in
          </Link>
          .
        </p>
      </>
    );
  }

  return (
    <div className="w-full max-w-md">
      <div className="mb-8 flex items-center gap-3">
        <SwardMark size={44} />
        <p className="text-2xl font-bold tracking-tight">Sward</p>
      </div>
      <section
        className="rounded-2xl border border-line bg-card p-6 shadow-sm sm:p-8"
        aria-labelledby="invitation-title"
      >
        <h1 id="invitation-title" className="mb-3 text-2xl font-bold">
          {title}
        </h1>
        {body}
      </section>
    </div>
  );
}
