// The service clients — mail (nodemailer over SMTP), the weather provider, the address geocoder,
// the routing service and photo storage — built in one place from the validated configuration of lib/env.ts. Route handlers, mutations,
// the worker (jobs/worker.ts) and the demo seed all take them from services(); a test swaps any
// of them for a fake with useServices(). No "server-only" here: the worker and scripts run it too.
import path from "node:path";

import { serviceEnv, type ServiceEnv } from "@/lib/env";

import { censusGeocoder, type Geocoder } from "./geocoder/client";
import { smtpMailer, type Mailer } from "./mail";
import { osrmRouting, type RoutingService } from "./routing/client";
import { localDiskStorage, s3Storage, type PhotoStorage } from "./storage";
import { openMeteoProvider, type WeatherProvider } from "./weather/provider";

export interface Services {
  /** Null without SMTP_URL: mail then waits in the outbox. */
  mailer: Mailer | null;
  /** Open-Meteo's API; null without WEATHER_BASE_URL. For background work: retries with back-off. */
  weather: WeatherProvider | null;
  /** The same service for moments a person is waiting (starting a visit): one try, 1.5 s. */
  quickWeather: WeatherProvider | null;
  /** The Census Bureau's geocoder (one try, 5 s: a manager is waiting); null without GEOCODER_BASE_URL. */
  geocoder: Geocoder | null;
  /** OSRM's Table API (one try, 2.5 s: a technician is waiting); null without ROUTING_BASE_URL. */
  routing: RoutingService | null;
  /** PHOTO_STORAGE=local (files under PHOTO_DIR) or s3. */
  photoStorage: PhotoStorage;
}

export function createServices(env: ServiceEnv): Services {
  const weather = (options: { timeoutMs?: number; retries?: number }) =>
    env.WEATHER_BASE_URL
      ? openMeteoProvider({
          baseUrl: env.WEATHER_BASE_URL,
          archiveUrl: env.WEATHER_ARCHIVE_URL,
          apiKey: env.WEATHER_API_KEY,
          ...options,
        })
      : null;
  return {
    mailer: env.SMTP_URL ? smtpMailer(env.SMTP_URL) : null,
    weather: weather({}),
    quickWeather: weather({ timeoutMs: 1500, retries: 0 }),
    geocoder: env.GEOCODER_BASE_URL ? censusGeocoder({ baseUrl: env.GEOCODER_BASE_URL }) : null,
    routing: env.ROUTING_BASE_URL
      ? osrmRouting({ baseUrl: env.ROUTING_BASE_URL, apiKey: env.ROUTING_API_KEY })
      : null,
    photoStorage:
      env.PHOTO_STORAGE === "s3"
        ? s3Storage({
            bucket: env.S3_BUCKET!,
            region: env.S3_REGION,
            endpoint: env.S3_ENDPOINT,
            accessKeyId: env.S3_ACCESS_KEY_ID,
            secretAccessKey: env.S3_SECRET_ACCESS_KEY,
          })
        : localDiskStorage(path.resolve(env.PHOTO_DIR)),
  };
}

let current: Services | undefined;

/** The process's service clients, built on first use from process.env (validated). */
export function services(): Services {
  current ??= createServices(serviceEnv());
  return current;
}

/** Tests: replaces some clients with fakes; call the returned function to put the real ones back. */
export function useServices(fakes: Partial<Services>): () => void {
  const before = services();
  current = { ...before, ...fakes };
  return () => {
    current = before;
  };
}
