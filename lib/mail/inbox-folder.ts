// The development inbox: the local fake SMTP service (tests/harness/smtp-fake.ts) keeps each
// message it receives as one JSON file in a folder; this reads them back.
import { readdir, readFile } from "node:fs/promises";
import path from "node:path";

export interface StoredMail {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string;
}

/** The messages in the inbox folder, oldest first (an absent folder is an empty inbox). */
export async function readInbox(dir: string): Promise<StoredMail[]> {
  const names = (await readdir(dir).catch(() => [] as string[]))
    .filter((n) => n.endsWith(".json"))
    .sort();
  return Promise.all(
    names.map(async (n) => JSON.parse(await readFile(path.join(dir, n), "utf8")) as StoredMail),
  );
}
