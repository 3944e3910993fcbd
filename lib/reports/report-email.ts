// The visit report e-mail to a homeowner (pure): a short summary, the care-note titles, the
// keep-off guidance of anything applied, photos as links, and one button to the report.
import { formatDate } from "@/lib/dates";
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
  >,
  appUrl: string,
  homeownerName: string,
) {
  const base = appUrl.replace(/\/$/, "");
  const link = `${base}${visitReportPath(report.visitId)}`;
  const subject = `Your lawn visit report — ${report.propertyName}, ${formatDate(report.date)}`;
  const keepOff = [...new Set(report.applications.map((a) => a.reentryGuidance).filter(Boolean))];
  const photos = report.zones.flatMap((z) =>
    z.photos.map((p) => ({ zone: z.name, url: `${base}${p.displayUrl}` })),
  );
  const score = report.propertyIndex === null ? null : Math.round(report.propertyIndex);
  const lines = [
    `Hello ${homeownerName},`,
    "",
    `${report.technicianName ?? report.companyName} visited ${report.propertyName} on ${formatDate(report.date)}.${score !== null ? ` Your lawn's Sward Index: ${score} out of 100.` : ""}`,
    ...(report.applications.length
      ? [
          "",
          `Applied: ${[...new Set(report.applications.map((a) => a.productName))].join(", ")}.`,
          ...keepOff.map((k) => `Safety: ${k}`),
        ]
      : []),
    ...(report.careNotes.length
      ? ["", "Care notes for you:", ...report.careNotes.map((n) => `• ${n.note.title}`)]
      : []),
    ...(photos.length
      ? ["", "Photos (sign in to see them):", ...photos.map((p) => `• ${p.zone}: ${p.url}`)]
      : []),
    "",
    `Read the full report: ${link}`,
    "To sign in, enter this e-mail address and we will send you a one-time sign-in link — no password needed.",
    "",
    `— ${report.companyName}`,
  ];
  const html = `<div style="font-family:system-ui,sans-serif;color:#18211b;max-width:36rem">
<p>Hello ${escapeHtml(homeownerName)},</p>
<p>${escapeHtml(report.technicianName ?? report.companyName)} visited <strong>${escapeHtml(report.propertyName)}</strong> on ${escapeHtml(formatDate(report.date))}.${score !== null ? ` Your lawn's Sward Index: <strong>${score}</strong> out of 100.` : ""}</p>
${report.applications.length ? `<p>Applied: ${escapeHtml([...new Set(report.applications.map((a) => a.productName))].join(", "))}.</p>${keepOff.map((k) => `<p style="background:#f6ecd6;padding:8px;border-radius:6px"><strong>Safety:</strong> ${escapeHtml(k)}</p>`).join("")}` : ""}
${report.careNotes.length ? `<p>Care notes for you:</p><ul>${report.careNotes.map((n) => `<li>${escapeHtml(n.note.title)}</li>`).join("")}</ul>` : ""}
${photos.length ? `<p>Photos (sign in to see them): ${photos.map((p) => `<a href="${escapeHtml(p.url)}">${escapeHtml(p.zone)}</a>`).join(" · ")}</p>` : ""}
<p><a href="${escapeHtml(link)}" style="display:inline-block;background:#2f6b3a;color:#fff;padding:12px 18px;border-radius:8px;text-decoration:none;font-weight:bold">Read your visit report</a></p>
<p style="color:#5b665e">To sign in, enter this e-mail address and we will send you a one-time sign-in link — no password needed.</p>
<p>— ${escapeHtml(report.companyName)}</p>
</div>`;
  return { subject, text: lines.join("\n"), html };
}
