// Outgoing mail through nodemailer: SMTP_URL (e.g. smtp://127.0.0.1:2525 for the local fake
// that the demo and tests start). Without SMTP_URL, nothing is sent and callers are told so.
import nodemailer, { type Transporter } from "nodemailer";

interface MailMessage {
  to: string | string[];
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(message: MailMessage): Promise<void>;
}

export const MAIL_FROM = "Sward <no-reply@sward.test>";

/** An SMTP mailer for smtp://host:port (no TLS on loopback), with short timeouts so an outage fails fast and is retried. */
export function smtpMailer(url: string): Mailer {
  const u = new URL(url);
  const transport: Transporter = nodemailer.createTransport({
    host: u.hostname,
    port: Number(u.port || 25),
    secure: u.protocol === "smtps:",
    ignoreTLS: u.protocol === "smtp:" && (u.hostname === "127.0.0.1" || u.hostname === "localhost"),
    auth: u.username
      ? { user: decodeURIComponent(u.username), pass: decodeURIComponent(u.password) }
      : undefined,
    connectionTimeout: 5000,
    greetingTimeout: 5000,
    socketTimeout: 10000,
  });
  return {
    async send(message) {
      await transport.sendMail({ from: MAIL_FROM, ...message });
    },
  };
}
