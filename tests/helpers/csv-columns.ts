// CSV exports carry their headers in words from the catalogue (lib/i18n/messages/en.ts); tests
// read the rows by the column ids, and fail on a header that is not the catalogue's word.
import { en } from "@/lib/i18n/messages/en";

const byLabel = (table: Record<string, string>) => (header: string[]) =>
  header.map((raw) => {
    const label = raw.replace(/^\uFEFF/, "");
    const key = Object.entries(table).find(([, l]) => l === label)?.[0];
    if (!key) throw new Error(`CSV header not in the catalogue: ${JSON.stringify(label)}`);
    return key;
  });

export const RECORD_KEYS = byLabel(en.csv.records);
export const BOOK_KEYS = byLabel(en.csv.book);
