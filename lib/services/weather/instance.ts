// The configured weather provider, or null when WEATHER_BASE_URL is not set. The "quick" one is
// for moments a person is waiting (starting a visit): one try, short timeout.
import { serverEnv } from "@/lib/env";

import { jsonWeatherProvider, type WeatherProvider } from "./provider";

const cache = new Map<string, WeatherProvider | null>();

export function weatherProvider(kind: "normal" | "quick" = "normal"): WeatherProvider | null {
  if (!cache.has(kind)) {
    const env = serverEnv();
    cache.set(
      kind,
      env.WEATHER_BASE_URL
        ? jsonWeatherProvider({
            baseUrl: env.WEATHER_BASE_URL,
            apiKey: env.WEATHER_API_KEY,
            ...(kind === "quick" ? { timeoutMs: 1500, retries: 0 } : {}),
          })
        : null,
    );
  }
  return cache.get(kind)!;
}
