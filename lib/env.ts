// Server configuration, validated once. A missing or malformed value stops the server with a
// message naming it (fail fast), instead of surfacing later as an obscure error.
import { z } from "zod";

const serverSchema = z
  .object({
    NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
    DATABASE_URL: z
      .string({
        error: "DATABASE_URL is required (e.g. postgres://postgres@127.0.0.1:54329/sward)",
      })
      .regex(/^postgres(ql)?:\/\//, "DATABASE_URL must be a postgres:// URL"),
    AUTH_SECRET: z
      .string({
        error:
          "AUTH_SECRET is required (32+ random characters; npm run demo writes one to .env.local)",
      })
      .min(32, "AUTH_SECRET must be at least 32 characters"),
    AUTH_URL: z.url().optional(),
    LOG_LEVEL: z
      .enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"])
      .default("info"),
    /** Failed sign-ins allowed per e-mail address within the window before it is throttled. */
    SIGN_IN_MAX_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
    /** Failed sign-ins allowed per client address within the window. */
    SIGN_IN_MAX_PER_ADDRESS: z.coerce.number().int().positive().default(20),
    SIGN_IN_WINDOW_MINUTES: z.coerce.number().int().positive().default(15),
    /** Sign-in links (homeowners) one e-mail address may ask for within the window. */
    SIGN_IN_LINK_MAX_PER_EMAIL: z.coerce.number().int().positive().default(3),
    /** Sign-in links one client address may ask for within the window. */
    SIGN_IN_LINK_MAX_PER_ADDRESS: z.coerce.number().int().positive().default(10),
    /** Outgoing mail, e.g. smtp://127.0.0.1:2525 (the local fake the demo and tests start). Unset: mail waits in the outbox. */
    SMTP_URL: z
      .string()
      .regex(/^smtps?:\/\//, "SMTP_URL must be an smtp:// or smtps:// URL")
      .optional(),
    /** Development only: the folder of the local fake SMTP service, shown to managers at /dev/mail. */
    MAIL_INBOX_DIR: z.string().optional(),
    /** Where photo derivatives live: "local" (PHOTO_DIR on this machine) or "s3". */
    PHOTO_STORAGE: z.enum(["local", "s3"]).default("local"),
    PHOTO_DIR: z.string().default(".data/photos"),
    S3_BUCKET: z.string().optional(),
    S3_REGION: z.string().default("us-east-1"),
    S3_ENDPOINT: z.url().optional(),
    S3_ACCESS_KEY_ID: z.string().optional(),
    S3_SECRET_ACCESS_KEY: z.string().optional(),
    /** Base URL of the daily-weather JSON service (the demo and tests start a local fake). */
    WEATHER_BASE_URL: z.url().optional(),
    WEATHER_API_KEY: z.string().optional(),
  })
  .refine((env) => env.PHOTO_STORAGE !== "s3" || Boolean(env.S3_BUCKET), {
    message: "S3_BUCKET is required when PHOTO_STORAGE=s3",
    path: ["S3_BUCKET"],
  });

export type ServerEnv = z.infer<typeof serverSchema>;

export function parseServerEnv(source: Record<string, string | undefined>): ServerEnv {
  const result = serverSchema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid server configuration:\n${lines.join("\n")}`);
  }
  return result.data;
}

let cached: ServerEnv | undefined;

export function serverEnv(): ServerEnv {
  cached ??= parseServerEnv(process.env);
  return cached;
}
