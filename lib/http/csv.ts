// CSV for spreadsheets: UTF-8 with a byte-order mark, and cells that a spreadsheet would run as
// a formula (starting with = + - @, or tab/carriage return) neutralised with a leading quote.
const UTF8_BOM = "\uFEFF";

function neutraliseCell(value: unknown): string {
  const text = value === null || value === undefined ? "" : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/**
 * Streams rows as a CSV download: BOM, header, text cells neutralised, numbers as they are. The
 * first page of rows is read before answering, so a query that fails (bad input, a database
 * error) answers with its own status instead of a 200 cut short mid-stream.
 */
export async function csvResponse(
  columns: readonly string[],
  rows: AsyncIterable<(string | number | null)[]>,
  filename: string,
): Promise<Response> {
  const iterator = rows[Symbol.asyncIterator]();
  const first = await iterator.next();
  const encoder = new TextEncoder();
  const body = new ReadableStream<Uint8Array>({
    async start(controller) {
      const { stringify } = await import("csv-stringify");
      const csv = stringify({
        header: true,
        columns: [...columns],
        cast: { number: (n) => String(n) },
      });
      csv.on("data", (chunk: Buffer | string) =>
        controller.enqueue(
          typeof chunk === "string" ? encoder.encode(chunk) : new Uint8Array(chunk),
        ),
      );
      controller.enqueue(encoder.encode(UTF8_BOM));
      const write = (row: (string | number | null)[]) =>
        csv.write(row.map((cell) => (typeof cell === "number" ? cell : neutraliseCell(cell))));
      try {
        for (let next = first; !next.done; next = await iterator.next()) write(next.value);
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
      "Content-Disposition": `attachment; filename="${filename}"`,
      "Cache-Control": "private, no-store",
    },
  });
}
