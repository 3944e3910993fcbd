// Server configuration, validated once. A missing or malformed value stops the server with a
// message naming it (fail fast), instead of surfacing later as an obscure error.
import { z } from "zod";

/**
 * What the service clients need (mail, weather, photo storage — see lib/services) and the address
 * links in e-mails point to: shared by the web server, the worker and the db scripts.
 */
const serviceFields = {
  NODE_ENV: z.enum(["development", "test", "production"]).default("development"),
  /**
   * The app's public address: every link in an e-mail and Auth.js's own URLs are built from it,
   * never from a request's Host or X-Forwarded-Host. Required in production; in development and
   * tests it defaults to http://localhost:$PORT.
   */
  AUTH_URL: z.url().optional(),
  PORT: z.string().optional(),
  /** Outgoing mail, e.g. smtp://127.0.0.1:2525 (the local fake the demo and tests start). Unset: mail waits in the outbox. */
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, "SMTP_URL must be an smtp:// or smtps:// URL")
    .optional(),
  /**
   * Development only: the folder of the local fake SMTP service, shown to managers at /dev/mail.
   * Refused unless the app's address is loopback (a machine's own demo), so a deployment others can
   * reach never shows live sign-in links to anyone.
   */
  MAIL_INBOX_DIR: z.string().optional(),
  /** Where photo derivatives live: "local" (PHOTO_DIR on this machine) or "s3". */
  PHOTO_STORAGE: z.enum(["local", "s3"]).default("local"),
  PHOTO_DIR: z.string().default(".data/photos"),
  S3_BUCKET: z.string().optional(),
  S3_REGION: z.string().default("us-east-1"),
  S3_ENDPOINT: z.url().optional(),
  S3_ACCESS_KEY_ID: z.string().optional(),
  S3_SECRET_ACCESS_KEY: z.string().optional(),
  /**
   * Origin of Open-Meteo's forecast API (https://api.open-meteo.com; the demo and tests start a
   * local fake that speaks the same API). Unset: no weather.
   */
  WEATHER_BASE_URL: z.url().optional(),
  /** Origin of Open-Meteo's historical-weather API (https://archive-api.open-meteo.com); default WEATHER_BASE_URL. */
  WEATHER_ARCHIVE_URL: z.url().optional(),
  /** Open-Meteo's commercial API key (sent as `apikey`); the free API needs none. */
  WEATHER_API_KEY: z.string().optional(),
  /**
   * Origin of the US Census Bureau's geocoder (https://geocoding.geo.census.gov), which turns a
   * property's address into its location; the demo and tests start a local fake that speaks the
   * same API. Unset: managers type the coordinates or use the device's location.
   */
  GEOCODER_BASE_URL: z.url().optional(),
  /**
   * The map's base style: the URL of a MapLibre style document (style specification v8) from a
   * hosted map service, `{key}` in it replaced by MAP_API_KEY, e.g.
   * https://maps.example.com/styles/basic/style.json?key={key}. The demo and tests start a local
   * fake with a plain style (tests/harness/map-tiles-fake.ts). Unset: the map draws the book on a
   * plain background. Its origin is allowed in the pages' Content-Security-Policy (proxy.ts).
   */
  MAP_STYLE_URL: z.url().optional(),
  /** The map service's key; it reaches the browser in the style URL, so restrict it to the app's origin at the service. */
  MAP_API_KEY: z.string().optional(),
  /**
   * Origin of a routing service that speaks the open-source OSRM engine's Table API (self-hosted
   * or hosted); the demo and tests start a local fake that speaks the same API. Unset: the day's
   * route uses the great-circle estimate, shown as "estimated".
   */
  ROUTING_BASE_URL: z.url().optional(),
  /** A hosted routing service's key, sent as a bearer token; a self-hosted engine needs none. */
  ROUTING_API_KEY: z.string().optional(),
};

const needsBucket = {
  check: (env: { PHOTO_STORAGE: string; S3_BUCKET?: string }) =>
    env.PHOTO_STORAGE !== "s3" || Boolean(env.S3_BUCKET),
  params: { message: "S3_BUCKET is required when PHOTO_STORAGE=s3", path: ["S3_BUCKET"] },
};

type UrlFields = { NODE_ENV: string; AUTH_URL?: string; PORT?: string; MAIL_INBOX_DIR?: string };

const APP_URL_REQUIRED =
  "AUTH_URL is required in production (the app's public address, e.g. https://sward.example.com): links in e-mails are built from it, never from request headers";

const needsAppUrl = {
  check: (env: UrlFields) => env.NODE_ENV !== "production" || Boolean(env.AUTH_URL),
  params: { message: APP_URL_REQUIRED, path: ["AUTH_URL"] },
};

const LOOPBACK_HOSTS = new Set(["localhost", "127.0.0.1", "[::1]"]);

/** The app's public origin (no trailing slash): AUTH_URL, or http://localhost:$PORT outside production. */
export function appOrigin(env: UrlFields): string {
  if (env.AUTH_URL) return new URL(env.AUTH_URL).origin;
  if (env.NODE_ENV === "production") throw new Error(APP_URL_REQUIRED);
  return `http://localhost:${env.PORT ?? "3000"}`;
}

const inboxOnlyOnLoopback = {
  check: (env: UrlFields) =>
    !env.MAIL_INBOX_DIR ||
    (needsAppUrl.check(env) && LOOPBACK_HOSTS.has(new URL(appOrigin(env)).hostname)),
  params: {
    message:
      "MAIL_INBOX_DIR (the development inbox at /dev/mail) is refused unless AUTH_URL is a loopback address (localhost, 127.0.0.1, [::1])",
    path: ["MAIL_INBOX_DIR"],
  },
};

const serviceSchema = z
  .object(serviceFields)
  .refine(needsBucket.check, needsBucket.params)
  .refine(needsAppUrl.check, needsAppUrl.params)
  .refine(inboxOnlyOnLoopback.check, inboxOnlyOnLoopback.params);

const serverSchema = z
  .object({
    ...serviceFields,
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
    LOG_LEVEL: z
      .enum(["fatal", "error", "warn", "info", "debug", "trace", "silent"])
      .default("info"),
    /** Failed sign-ins allowed per e-mail address from one client address within the window. */
    SIGN_IN_MAX_PER_ACCOUNT: z.coerce.number().int().positive().default(5),
    /** Failed sign-ins allowed per e-mail address from all client addresses (addresses that signed in to it before are exempt). */
    SIGN_IN_MAX_PER_ACCOUNT_ALL_ADDRESSES: z.coerce.number().int().positive().default(50),
    /** Proxies in front of the app that append to X-Forwarded-For (read by lib/http/edge-address.mjs). */
    TRUSTED_PROXY_COUNT: z.coerce.number().int().min(0).max(10).default(0),
    /** Failed sign-ins allowed per client address within the window. */
    SIGN_IN_MAX_PER_ADDRESS: z.coerce.number().int().positive().default(20),
    SIGN_IN_WINDOW_MINUTES: z.coerce.number().int().positive().default(15),
    /** Sign-in links (homeowners) one e-mail address may ask for within the window. */
    SIGN_IN_LINK_MAX_PER_EMAIL: z.coerce.number().int().positive().default(3),
    /** Sign-in links one client address may ask for within the window. */
    SIGN_IN_LINK_MAX_PER_ADDRESS: z.coerce.number().int().positive().default(10),
  })
  .refine(needsBucket.check, needsBucket.params)
  .refine(needsAppUrl.check, needsAppUrl.params)
  .refine(inboxOnlyOnLoopback.check, inboxOnlyOnLoopback.params);

export type ServiceEnv = z.infer<typeof serviceSchema>;
export type ServerEnv = z.infer<typeof serverSchema>;

type Source = Record<string, string | undefined>;

function parse<T>(schema: z.ZodType<T>, source: Source, what: string): T {
  const result = schema.safeParse(source);
  if (!result.success) {
    const lines = result.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`);
    throw new Error(`Invalid ${what} configuration:\n${lines.join("\n")}`);
  }
  return result.data;
}

export const parseServerEnv = (source: Source): ServerEnv => parse(serverSchema, source, "server");
export const parseServiceEnv = (source: Source): ServiceEnv =>
  parse(serviceSchema, source, "service");

let cachedServer: ServerEnv | undefined;
let cachedServices: ServiceEnv | undefined;

/** Everything the web server needs, read from process.env once. */
export function serverEnv(): ServerEnv {
  cachedServer ??= parseServerEnv(process.env);
  return cachedServer;
}

/** The app's public origin for links in e-mails (see appOrigin). */
export const appUrl = (): string => appOrigin(serviceEnv());

/** The map's base style URL with its key, or null when no map service is configured. */
export function mapStyleUrl(): string | null {
  const { MAP_STYLE_URL, MAP_API_KEY } = serviceEnv();
  if (!MAP_STYLE_URL) return null;
  return MAP_STYLE_URL.replaceAll("{key}", encodeURIComponent(MAP_API_KEY ?? ""));
}

/** The development inbox's folder, or undefined: only ever set on a loopback app address (checked above). */
export const devInboxDir = (): string | undefined => serviceEnv().MAIL_INBOX_DIR;

/**
 * The service clients' part alone, read from process.env once: the worker and the db scripts need
 * no sign-in secret, so they do not have to carry one.
 */
export function serviceEnv(): ServiceEnv {
  cachedServices ??= parseServiceEnv(process.env);
  return cachedServices;
}
