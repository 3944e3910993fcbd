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
  const subject = invitationSubject(input.companyName, input.locale);
  const greeting = input.name ? t("hello", { name: input.name }) : t("helloNoName");
  const intro = t("invitation.intro", {
    company: input.companyName,
    place: `${input.street}, ${input.city}`,
  });
  const action = t("invitation.action", { days: input.days });
  const ignore = t("invitation.ignore");
  const signOff = t("signOff", { company: input.companyName });
  const text = [greeting, "", intro, "", `${action}:`, input.link, "", ignore, "", signOff].join(
    "\n",
  );
  const html = emailFrame([
    `<p>${escapeHtml(greeting)}</p>`,
    `<p>${escapeHtml(intro)}</p>`,
    `<p>${escapeHtml(action)}.</p>`,
    emailButton(input.link, t("invitation.button")),
    `<p style="color:#5b665e;word-break:break-all">${escapeHtml(t("buttonFallback"))}<br>${escapeHtml(input.link)}</p>`,
    `<p style="color:#5b665e">${escapeHtml(ignore)}</p>`,
    `<p>${escapeHtml(signOff)}</p>`,
  ]);
  return { subject, text, html };
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
  const subject = staffInvitationSubject(input.companyName, input.locale);
  const greeting = input.name ? t("hello", { name: input.name }) : t("helloNoName");
  const intro = t("staffInvitation.intro", { company: input.companyName, role: input.role });
  const action = t("staffInvitation.action", { days: input.days });
  const ignore = t("staffInvitation.ignore");
  const signOff = t("signOff", { company: input.companyName });
  const text = [greeting, "", intro, "", `${action}:`, input.link, "", ignore, "", signOff].join(
    "\n",
  );
  const html = emailFrame([
    `<p>${escapeHtml(greeting)}</p>`,
    `<p>${escapeHtml(intro)}</p>`,
    `<p>${escapeHtml(action)}.</p>`,
    emailButton(input.link, t("staffInvitation.button")),
    `<p style="color:#5b665e;word-break:break-all">${escapeHtml(t("buttonFallback"))}<br>${escapeHtml(input.link)}</p>`,
    `<p style="color:#5b665e">${escapeHtml(ignore)}</p>`,
    `<p>${escapeHtml(signOff)}</p>`,
  ]);
  return { subject, text, html };
}
