import { ArrowLeft } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";

import { VisitReportView } from "@/components/visit-reports/visit-report";
import { requireActor } from "@/lib/auth/require";
import { AppError } from "@/lib/http/app-error";
import { visitReportPath } from "@/lib/paths";
import { getVisitReport } from "@/lib/reports/queries";
import { visitIdParams } from "@/lib/visits/schemas";

export const metadata: Metadata = { title: "Visit report" };

export default async function VisitReportPage({
  params,
}: {
  params: Promise<{ visitId: string }>;
}) {
  const parsed = visitIdParams.safeParse(await params);
  const actor = await requireActor(
    ["homeowner"],
    parsed.success ? visitReportPath(parsed.data.visitId) : "/my-lawn",
  );
  if (!parsed.success) notFound();
  const report = await getVisitReport(actor, parsed.data.visitId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });
  return (
    <>
      <Link
        href="/my-lawn"
        className="no-print mb-4 inline-flex min-h-tap items-center gap-1 font-semibold text-sward"
      >
        <ArrowLeft className="size-5" aria-hidden="true" />
        My lawn
      </Link>
      <VisitReportView report={report} />
    </>
  );
}
