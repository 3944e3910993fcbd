// `npm run mail:inbox [count]`: the latest messages the local fake SMTP service received.
import { readInbox } from "./smtp-fake";

const count = Number(process.argv[2] ?? 5);
const mails = (await readInbox(process.env.MAIL_DIR ?? ".data/mail")).slice(-count);
if (!mails.length) console.log("inbox: empty (.data/mail). Start the demo: npm run demo");
for (const m of mails)
  console.log(
    `── ${m.receivedAt}  to ${m.to.join(", ")}\n   ${m.subject}\n\n${m.text.replace(/^/gm, "   ")}\n`,
  );
