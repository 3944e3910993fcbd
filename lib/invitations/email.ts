// The invitation e-mail to a homeowner (pure): who invites them, to which lawn, one button, how
// long it works, and what to do when it was not meant for them. The same message whatever the
// address: whether it has an account is only looked at when the person opens the link.
import { escapeHtml } from "@/lib/text";

/** The subject of a company's invitation e-mails (the development inbox recognises them by it). */
export const invitationSubject = (companyName: string) =>
  `${companyName} invites you to follow your lawn`;

export function invitationEmail(input: {
  link: string;
  days: number;
  companyName: string;
  name: string;
  street: string;
  city: string;
}) {
  const subject = invitationSubject(input.companyName);
  const greeting = input.name ? `Hello ${input.name},` : "Hello,";
  const place = `${input.street}, ${input.city}`;
  const intro = `${input.companyName} keeps a journal of the lawn at ${place}: what each visit found, what was applied and why, and what to do between visits.`;
  const action = `Open this link to accept the invitation. It works once, within ${input.days} days:`;
  const ignore =
    "If you do not know this company or this lawn, ignore this e-mail: nothing is linked unless you accept.";
  const text = [
    greeting,
    "",
    intro,
    "",
    action,
    input.link,
    "",
    ignore,
    "",
    `— ${input.companyName}`,
  ].join("\n");
  const html = `<div style="font-family:system-ui,sans-serif;color:#18211b;max-width:36rem">
<p>${escapeHtml(greeting)}</p>
<p>${escapeHtml(intro)}</p>
<p>${escapeHtml(action.replace(/:$/, "."))}</p>
<p><a href="${escapeHtml(input.link)}" style="display:inline-block;background:#2f6b3a;color:#fff;padding:12px 18px;border-radius:8px;text-decoration:none;font-weight:bold">See the invitation</a></p>
<p style="color:#5b665e;word-break:break-all">If the button does not work, copy this address into your browser:<br>${escapeHtml(input.link)}</p>
<p style="color:#5b665e">${escapeHtml(ignore)}</p>
<p>— ${escapeHtml(input.companyName)}</p>
</div>`;
  return { subject, text, html };
}
