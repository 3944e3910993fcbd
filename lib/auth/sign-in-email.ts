// The sign-in link e-mail to a homeowner (pure): one button, how long it works, and what to do
// when they did not ask for it.
import { escapeHtml } from "@/lib/text";

export function signInLinkEmail(input: {
  link: string;
  minutes: number;
  companyName: string;
  name: string;
}) {
  const subject = `Your sign-in link for ${input.companyName}`;
  const greeting = input.name ? `Hello ${input.name},` : "Hello,";
  const text = [
    greeting,
    "",
    `Open this link to sign in and see your lawn's visit reports. It works once, within ${input.minutes} minutes:`,
    input.link,
    "",
    "If you did not ask to sign in, ignore this e-mail: nobody can sign in without the link.",
    "",
    `— ${input.companyName}`,
  ].join("\n");
  const html = `<div style="font-family:system-ui,sans-serif;color:#18211b;max-width:36rem">
<p>${escapeHtml(greeting)}</p>
<p>Open this link to sign in and see your lawn's visit reports. It works once, within ${input.minutes} minutes.</p>
<p><a href="${escapeHtml(input.link)}" style="display:inline-block;background:#2f6b3a;color:#fff;padding:12px 18px;border-radius:8px;text-decoration:none;font-weight:bold">Sign in to see your lawn</a></p>
<p style="color:#5b665e;word-break:break-all">If the button does not work, copy this address into your browser:<br>${escapeHtml(input.link)}</p>
<p style="color:#5b665e">If you did not ask to sign in, ignore this e-mail: nobody can sign in without the link.</p>
<p>— ${escapeHtml(input.companyName)}</p>
</div>`;
  return { subject, text, html };
}
