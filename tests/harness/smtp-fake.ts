// The local fake SMTP service (development and tests): accepts mail on 127.0.0.1 without auth,
// parses it and keeps every message as JSON in a folder (the development inbox).
// `tsx tests/harness/smtp-fake.ts [port] [dir]` — defaults 2525 and .data/mail.
import { mkdir, writeFile } from "node:fs/promises";
import path from "node:path";
import { simpleParser } from "mailparser";
import { SMTPServer } from "smtp-server";

import type { StoredMail } from "@/lib/mail/inbox-folder";

export { readInbox } from "@/lib/mail/inbox-folder";

export async function startSmtpFake(
  port: number,
  dir: string,
): Promise<{ server: SMTPServer; port: number; close: () => Promise<void> }> {
  await mkdir(dir, { recursive: true });
  let seq = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ["STARTTLS"],
    size: 10 * 1024 * 1024,
    logger: false,
    onData(stream, _session, callback) {
      simpleParser(stream)
        .then(async (mail) => {
          const id = `${Date.now()}-${String(++seq).padStart(4, "0")}`;
          const to = (Array.isArray(mail.to) ? mail.to : mail.to ? [mail.to] : []).flatMap((a) =>
            a.value.map((v) => v.address ?? ""),
          );
          const stored: StoredMail = {
            id,
            receivedAt: new Date().toISOString(),
            from: mail.from?.text ?? "",
            to,
            subject: mail.subject ?? "",
            text: mail.text ?? "",
            html: typeof mail.html === "string" ? mail.html : "",
          };
          await writeFile(path.join(dir, `${id}.json`), JSON.stringify(stored, null, 2));
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(port, "127.0.0.1", () => resolve());
  });
  const address = server.server.address();
  return {
    server,
    port: typeof address === "object" && address ? address.port : port,
    close: () => new Promise((r) => server.close(() => r())),
  };
}

if (
  process.argv[1] &&
  path.resolve(process.argv[1]) === path.resolve(new URL(import.meta.url).pathname)
) {
  const port = Number(process.argv[2] ?? 2525);
  const dir = process.argv[3] ?? ".data/mail";
  const { port: bound } = await startSmtpFake(port, dir);
  console.log(`smtp fake: listening on 127.0.0.1:${bound}, inbox ${dir}`);
}
