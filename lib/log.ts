// Structured JSON logs to stdout (pino). Never log passwords, tokens or full request bodies.
import pino from "pino";

export const log = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === "test" ? "silent" : "info"),
  base: { app: "sward" },
  redact: { paths: ["password", "*.password", "token", "*.token", "headers.cookie"], remove: true },
});

/**
 * An e-mail address as logs may carry it: the first character of the mailbox and the domain
 * ("m…@demo.sward.test"), enough to follow an incident without writing the address down.
 */
export function maskEmail(email: string): string {
  const at = email.lastIndexOf("@");
  if (at < 1) return "…";
  return `${email.slice(0, 1)}…${email.slice(at)}`.slice(0, 120);
}
