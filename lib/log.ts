// Structured JSON logs to stdout (pino). Never log passwords, tokens or full request bodies.
import pino from "pino";

export const log = pino({
  level: process.env.LOG_LEVEL ?? (process.env.NODE_ENV === "test" ? "silent" : "info"),
  base: { app: "sward" },
  redact: { paths: ["password", "*.password", "token", "*.token", "headers.cookie"], remove: true },
});
