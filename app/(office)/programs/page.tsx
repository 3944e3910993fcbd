import type { Metadata } from "next";
import { NextIntlClientProvider } from "next-intl";
import { getMessages } from "next-intl/server";

import { ProgramList } from "@/components/programs/program-list";
import { requireActor } from "@/lib/auth/require";
import { listProducts } from "@/lib/products/queries";
import { listPrograms } from "@/lib/programs/queries";

export const metadata: Metadata = { title: "Programs" };

export default async function ProgramsPage() {
  const actor = await requireActor(["manager"]);
  const [programs, products, messages] = await Promise.all([
    listPrograms(actor),
    listProducts(actor),
    getMessages(),
  ]);
  return (
    <>
      <h1 className="text-3xl font-bold">Season programs</h1>
      <p className="mt-1 mb-6 text-muted">
        The rounds a lawn gets through the season. Each property follows one program; its page shows
        each zone&apos;s planned nitrogen per round. Sward&apos;s plan helps; the product label,
        local fertilizer ordinances and licensed practice take precedence.
      </p>
      <NextIntlClientProvider messages={{ terms: messages.terms }}>
        <ProgramList
          programs={programs}
          products={products
            .filter((p) => !p.isArchived)
            .map((p) => ({ id: p.id, name: p.name, form: p.form, nPct: p.nPct }))}
        />
      </NextIntlClientProvider>
    </>
  );
}
