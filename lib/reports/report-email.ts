// The visit report e-mail to a homeowner (pure): a short summary, the care-note titles, the
// keep-off guidance of anything applied, photos as links, and one button to the report. Words
// from the catalogue (lib/i18n/messages, "report" and "email"), the same the report page reads.
import { formatDate } from "@/lib/dates";
import { translator, words } from "@/lib/i18n/translate";
import { emailButton, emailFrame } from "@/lib/mail/layout";
import { visitReportPath } from "@/lib/paths";
import type { VisitReport } from "@/lib/reports/dto";
import { escapeHtml } from "@/lib/text";

export function reportEmail(
  report: Pick<
    VisitReport,
    | "visitId"
    | "date"
    | "propertyName"
    | "companyName"
    | "technicianName"
    | "propertyIndex"
    | "zones"
    | "applications"
    | "careNotes"
    | "nextVisit"
  >,
  appUrl: string,
  homeownerName: string,
  locale?: string | null,
  /** The one-time sign-in link that opens the report (lib/auth/sign-in-link.ts reportSignInLink). */
  signedLink?: { url: string; hours: number },
) {
  const mail = words(locale, "report.mail");
  const email = words(locale, "email");
  const base = appUrl.replace(/\/$/, "");
  const link = `${base}${visitReportPath(report.visitId)}`;
  const button = signedLink?.url ?? link;
  const date = formatDate(report.date, locale ?? undefined);
  const subject = mail("subject", { property: report.propertyName, date });
  const keepOff = [...new Set(report.applications.map((a) => a.reentryGuidance).filter(Boolean))];
  const products = [...new Set(report.applications.map((a) => a.productName))].join(", ");
  const photos = report.zones.flatMap((z) =>
    z.photos.map((p) => ({ zone: z.name, url: `${base}${p.displayUrl}` })),
  );
  const score = report.propertyIndex === null ? null : Math.round(report.propertyIndex);
  const visited = mail("visited", {
    who: report.technicianName ?? report.companyName,
    property: report.propertyName,
    date,
  });
  // The Index sentence is the report page's own; <strong> marks the figure in both.
  const index = (strong: (chunks: string) => string) =>
    score === null
      ? ""
      : ` ${translator(locale, "report").markup("index", { score: String(score), strong })}`;
  const next = report.nextVisit
    ? mail("nextVisit", {
        service: words(locale, "terms.plannedServices")(report.nextVisit.service),
        date: formatDate(report.nextVisit.date, locale ?? undefined),
      })
    : null;
  const hello = email("hello", { name: homeownerName });
  const signOff = email("signOff", { company: report.companyName });
  const lines = [
    hello,
    "",
    `${visited}${index((s) => s)}`,
    ...(report.applications.length
      ? ["", mail("appliedList", { products }), ...keepOff.map((k) => `${mail("safety")} ${k}`)]
      : []),
    ...(report.careNotes.length
      ? ["", mail("careNotesForYou"), ...report.careNotes.map((n) => `• ${n.note.title}`)]
      : []),
    ...(photos.length ? ["", mail("photos"), ...photos.map((p) => `• ${p.zone}: ${p.url}`)] : []),
    ...(next ? ["", next] : []),
    "",
    ...(signedLink
      ? [
          `${mail("readFull", { hours: signedLink.hours })} ${signedLink.url}`,
          "",
          mail("linkOnce", { hours: signedLink.hours }),
          link,
        ]
      : [link]),
    mail("howToSignIn"),
    "",
    signOff,
  ];
  const html = emailFrame([
    `<p>${escapeHtml(hello)}</p>`,
    `<p>${escapeHtml(visited)}${index((s) => `<strong>${s}</strong>`)}</p>`,
    report.applications.length
      ? `<p>${escapeHtml(mail("appliedList", { products }))}</p>${keepOff.map((k) => `<p style="background:#f6ecd6;padding:8px;border-radius:6px"><strong>${escapeHtml(mail("safety"))}</strong> ${escapeHtml(k)}</p>`).join("")}`
      : "",
    report.careNotes.length
      ? `<p>${escapeHtml(mail("careNotesForYou"))}</p><ul>${report.careNotes.map((n) => `<li>${escapeHtml(n.note.title)}</li>`).join("")}</ul>`
      : "",
    photos.length
      ? `<p>${escapeHtml(mail("photos"))} ${photos.map((p) => `<a href="${escapeHtml(p.url)}">${escapeHtml(p.zone)}</a>`).join(" · ")}</p>`
      : "",
    next ? `<p>${escapeHtml(next)}</p>` : "",
    emailButton(button, mail("button")),
    signedLink
      ? `<p style="color:#5b665e">${escapeHtml(mail("linkOnce", { hours: signedLink.hours }))} <a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`
      : `<p style="color:#5b665e"><a href="${escapeHtml(link)}">${escapeHtml(link)}</a></p>`,
    `<p style="color:#5b665e">${escapeHtml(mail("howToSignIn"))}</p>`,
    `<p>${escapeHtml(signOff)}</p>`,
  ]);
  return { subject, text: lines.join("\n"), html };
}
