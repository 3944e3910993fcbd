// GET /api/v1/records/applications?from=YYYY-MM-DD&to=YYYY-MM-DD — the application records of a
// date range as CSV (UTF-8 with BOM, ISO dates, formula-like cells neutralised), streamed (manager).
import { stringify } from "csv-stringify";
import { z } from "zod";
import { RECORD_COLUMNS, applicationRecords } from "@/lib/applications/records/queries";
import { route } from "@/lib/auth/guards";
import { isIsoDate } from "@/lib/dates";
import { UTF8_BOM, neutraliseCell } from "@/lib/http/csv";

const isoDate = z.string().refine(isIsoDate, "Use a date like 2026-06-15.");
const query = z
  .object({ from: isoDate, to: isoDate })
  .strict()
  .refine((q) => q.from <= q.to, { message: "The start must not be after the end.", path: ["to"] });

export const GET = route({ access: ["manager"], query }, async ({ actor, query }) => {
  const rows = applicationRecords(actor, query.from, query.to);
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    async start(controller) {
      const csv = stringify({ header: true, columns: [...RECORD_COLUMNS], cast: { number: (n) => String(n) } });
      csv.on("data", (chunk: Buffer | string) => controller.enqueue(typeof chunk === "string" ? encoder.encode(chunk) : new Uint8Array(chunk)));
      controller.enqueue(encoder.encode(UTF8_BOM));
      try {
        for await (const row of rows) csv.write(row.map((cell) => (typeof cell === "number" ? cell : neutraliseCell(cell))));
        csv.end();
        await new Promise<void>((resolve) => csv.on("end", () => resolve()));
        controller.close();
      } catch (err) {
        controller.error(err);
      }
    },
  });
  return new Response(body, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="application-records-${query.from}-to-${query.to}.csv"`,
      "Cache-Control": "private, no-store",
    },
  });
});
