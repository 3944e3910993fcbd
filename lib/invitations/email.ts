// The invitation e-mail to a homeowner (pure): who invites them, to which lawn, one button, how
// long it works, and what to do when it was not meant for them. The same message whatever the
// address: whether it has an account is only looked at when the person opens the link. Words
// from the catalogue (lib/i18n/messages, "email.invitation").
import { words } from "@/lib/i18n/translate";
import { emailButton, emailFrame } from "@/lib/mail/layout";
import { escapeHtml } from "@/lib/text";

/** The subject of a company's invitation e-mails (the development inbox recognises them by it). */
export const invitationSubject = (companyName: string, locale?: string | null) =>
  words(locale, "email")("invitation.subject", { company: companyName });

/** The words of one invitation e-mail, already in the reader's language. */
interface InvitationWords {
  subject: string;
  greeting: string;
  intro: string;
  action: string;
  button: string;
  buttonFallback: string;
  ignore: string;
  signOff: string;
}

/** Lays out an invitation e-mail (both kinds): text and escaped HTML with one button. */
function invitationMessage(link: string, w: InvitationWords) {
  const text = [
    w.greeting,
    "",
    w.intro,
    "",
    `${w.action}:`,
    link,
    "",
    w.ignore,
    "",
    w.signOff,
  ].join("\n");
  const html = emailFrame([
    `<p>${escapeHtml(w.greeting)}</p>`,
    `<p>${escapeHtml(w.intro)}</p>`,
    `<p>${escapeHtml(w.action)}.</p>`,
    emailButton(link, w.button),
    `<p style="color:#5b665e;word-break:break-all">${escapeHtml(w.buttonFallback)}<br>${escapeHtml(link)}</p>`,
    `<p style="color:#5b665e">${escapeHtml(w.ignore)}</p>`,
    `<p>${escapeHtml(w.signOff)}</p>`,
  ]);
  return { subject: w.subject, text, html };
}

export function invitationEmail(input: {
  link: string;
  days: number;
  companyName: string;
  name: string;
  street: string;
  city: string;
  locale?: string | null;
}) {
  const t = words(input.locale, "email");
  return invitationMessage(input.link, {
    subject: invitationSubject(input.companyName, input.locale),
    greeting: input.name ? t("hello", { name: input.name }) : t("helloNoName"),
    intro: t("invitation.intro", {
      company: input.companyName,
      place: `${input.street}, ${input.city}`,
    }),
    action: t("invitation.action", { days: input.days }),
    button: t("invitation.button"),
    buttonFallback: t("buttonFallback"),
    ignore: t("invitation.ignore"),
    signOff: t("signOff", { company: input.companyName }),
  });
}

/** The subject of a company's staff invitation e-mails (the development inbox recognises them by it). */
export const staffInvitationSubject = (companyName: string, locale?: string | null) =>
  words(locale, "email")("staffInvitation.subject", { company: companyName });

/** The invitation e-mail to a technician or a manager: who invites them, as what, one button. */
export function staffInvitationEmail(input: {
  link: string;
  days: number;
  companyName: string;
  name: string;
  role: "manager" | "technician";
  locale?: string | null;
}) {
  const t = words(input.locale, "email");
  return invitationMessage(input.link, {
    subject: staffInvitationSubject(input.companyName, input.locale),
    greeting: input.name ? t("hello", { name: input.name }) : t("helloNoName"),
    intro: t("staffInvitation.intro", { company: input.companyName, role: input.role }),
    action: t("staffInvitation.action", { days: input.days }),
    button: t("staffInvitation.button"),
    buttonFallback: t("buttonFallback"),
    ignore: t("staffInvitation.ignore"),
    signOff: t("signOff", { company: input.companyName }),
  });
}
