// A visit report for the homeowner: what was seen in each zone in plain words, what was applied
// with its cautions and keep-off time, the photos, and the care notes that match what was seen.
import { ShieldAlert } from "lucide-react";
import { useTranslations } from "next-intl";

import { PhotoFigure } from "@/components/photos/photo-figure";
import { formatDate } from "@/lib/dates";
import { PHOTO_COVER_EXPLAINED } from "@/lib/photos/words";
import type { VisitReport } from "@/lib/reports/dto";

import { PrintButton } from "./print-button";

export function VisitReportView({ report }: { report: VisitReport }) {
  const t = useTranslations("report");
  return (
    <article className="space-y-8" aria-labelledby="report-title">
      <header className="space-y-1">
        <p className="text-sm font-semibold text-muted">
          {t("kicker", { company: report.companyName })}
        </p>
        <h1 id="report-title" className="text-3xl font-bold">
          {t("title", { property: report.propertyName, date: formatDate(report.date) })}
        </h1>
        <p className="text-muted">{report.address}</p>
        <p>
          {report.technicianName ? `${t("technician", { name: report.technicianName })} ` : ""}
          {report.weather
            ? t("weather", {
                high: Math.round(report.weather.tmaxF),
                low: Math.round(report.weather.tminF),
                rain: report.weather.precipIn.toFixed(2),
              })
            : ""}
        </p>
        {report.propertyIndex !== null ? (
          <p className="text-lg">
            {t.rich("index", {
              score: Math.round(report.propertyIndex),
              strong: (chunks) => <strong className="text-2xl text-sward">{chunks}</strong>,
            })}
          </p>
        ) : null}
        <div className="pt-2">
          <PrintButton />
        </div>
      </header>

      <section aria-labelledby="seen-title">
        <h2 id="seen-title" className="mb-3 text-2xl font-bold">
          {t("seen")}
        </h2>
        <div className="space-y-4">
          {report.zones.map((z) => (
            <div
              key={z.zoneId}
              className="break-inside-avoid rounded-xl border border-line bg-card p-4"
            >
              <h3 className="text-xl font-bold">{z.name}</h3>
              {z.skipped ? (
                <p className="mt-1">{t("notChecked", { reason: z.skipped.toLowerCase() })}</p>
              ) : (
                <ul className="mt-1 list-disc space-y-1 pl-5">
                  {z.sentences.map((s) => (
                    <li key={s}>{s}</li>
                  ))}
                </ul>
              )}
              {z.photos.length ? (
                <ul
                  className="mt-3 grid grid-cols-2 gap-3 sm:grid-cols-3"
                  aria-label={t("photosOf", { zone: z.name })}
                >
                  {z.photos.map((p) => (
                    <li key={p.id}>
                      <PhotoFigure photo={p} forHomeowner />
                    </li>
                  ))}
                </ul>
              ) : null}
            </div>
          ))}
        </div>
        {report.zones.some((z) => z.photos.length) ? (
          <p className="mt-3 text-sm text-muted">{PHOTO_COVER_EXPLAINED}</p>
        ) : null}
      </section>

      <section aria-labelledby="applied-title">
        <h2 id="applied-title" className="mb-3 text-2xl font-bold">
          {t("applied")}
        </h2>
        {report.applications.length === 0 ? (
          <p className="rounded-lg border border-line bg-card p-4">{t("nothingApplied")}</p>
        ) : (
          <ul className="space-y-3">
            {report.applications.map((a, i) => (
              <li
                key={`${a.productName}-${a.zoneName}-${i}`}
                className="break-inside-avoid rounded-xl border border-line bg-card p-4"
              >
                <p className="font-bold">
                  {t("productOnZone", { product: a.productName, zone: a.zoneName.toLowerCase() })}
                </p>
                {a.nLb > 0 || a.p2o5Lb > 0 || a.k2oLb > 0 ? (
                  <p className="text-sm text-muted">
                    {t("nutrients", {
                      n: a.nLb.toFixed(2),
                      p: a.p2o5Lb.toFixed(2),
                      k: a.k2oLb.toFixed(2),
                    })}
                  </p>
                ) : null}
                {a.isPesticide && a.registrationNumber ? (
                  <p className="text-sm text-muted">
                    {t("registration", { number: a.registrationNumber })}
                  </p>
                ) : null}
                {a.reentryGuidance ? (
                  <p className="mt-2 flex items-start gap-2 rounded-lg bg-sun-tint p-3 font-semibold">
                    <ShieldAlert className="mt-0.5 size-5 shrink-0 text-sun" aria-hidden="true" />
                    {a.reentryGuidance}
                  </p>
                ) : null}
                {a.labelCautions ? (
                  <p className="mt-2 text-sm">{t("fromLabel", { cautions: a.labelCautions })}</p>
                ) : null}
              </li>
            ))}
          </ul>
        )}
        <p className="mt-3 text-sm text-muted">{t("labelIsLaw")}</p>
      </section>

      <section aria-labelledby="notes-title">
        <h2 id="notes-title" className="mb-3 text-2xl font-bold">
          {t("careNotes")}
        </h2>
        {report.careNotes.length === 0 ? (
          <p className="rounded-lg border border-line bg-card p-4">{t("noCareNotes")}</p>
        ) : (
          <ul className="space-y-3">
            {report.careNotes.map(({ note, because }) => (
              <li
                key={note.key}
                className="break-inside-avoid rounded-xl border border-line bg-card p-4"
              >
                <h3 className="text-lg font-bold">{note.title}</h3>
                <p className="mt-1 text-sm text-muted">
                  {t("because", { findings: because.join("; ") })}
                </p>
                <p className="mt-2">{note.body}</p>
                <p className="mt-1 text-sm text-muted">{t("source", { source: note.source })}</p>
                {note.cautions?.map((c) => (
                  <p
                    key={c}
                    className="mt-2 flex items-start gap-2 rounded-lg bg-sun-tint p-3 text-sm"
                  >
                    <ShieldAlert className="mt-0.5 size-5 shrink-0 text-sun" aria-hidden="true" />
                    {c}
                  </p>
                ))}
              </li>
            ))}
          </ul>
        )}
      </section>
    </article>
  );
}
