// The sign-in link e-mail to a homeowner (pure): one button, how long it works, and what to do
// when they did not ask for it. Words from the catalogue (lib/i18n/messages, "email").
import { words } from "@/lib/i18n/translate";
import { emailButton, emailFrame } from "@/lib/mail/layout";
import { escapeHtml } from "@/lib/text";

export function signInLinkEmail(input: {
  link: string;
  minutes: number;
  companyName: string;
  name: string;
  locale?: string | null;
}) {
  const t = words(input.locale, "email");
  const subject = t("signIn.subject", { company: input.companyName });
  const greeting = input.name ? t("hello", { name: input.name }) : t("helloNoName");
  const body = t("signIn.body", { minutes: input.minutes });
  const ignore = t("signIn.ignore");
  const signOff = t("signOff", { company: input.companyName });
  const text = [greeting, "", `${body}:`, input.link, "", ignore, "", signOff].join("\n");
  const html = emailFrame([
    `<p>${escapeHtml(greeting)}</p>`,
    `<p>${escapeHtml(body)}.</p>`,
    emailButton(input.link, t("signIn.button")),
    `<p style="color:#5b665e;word-break:break-all">${escapeHtml(t("buttonFallback"))}<br>${escapeHtml(input.link)}</p>`,
    `<p style="color:#5b665e">${escapeHtml(ignore)}</p>`,
    `<p>${escapeHtml(signOff)}</p>`,
  ]);
  return { subject, text, html };
}
