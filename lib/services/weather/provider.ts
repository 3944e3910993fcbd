// The weather client: plain fetch to the JSON contract, with a timeout, retries with back-off,
// and zod validation. Anything unexpected becomes a WeatherUnavailable error, never a crash.
import { weatherResponseSchema, type WeatherDayInput } from "./contract";

export class WeatherUnavailable extends Error {
  constructor(message: string) {
    super(message);
    this.name = "WeatherUnavailable";
  }
}

export interface WeatherProvider {
  daily(lat: number, lon: number, start: string, end: string): Promise<WeatherDayInput[]>;
}

export function jsonWeatherProvider(options: {
  baseUrl: string;
  apiKey?: string;
  timeoutMs?: number;
  retries?: number;
  backoffMs?: number;
}): WeatherProvider {
  const { baseUrl, apiKey, timeoutMs = 4000, retries = 2, backoffMs = 300 } = options;
  return {
    async daily(lat, lon, start, end) {
      const url = `${baseUrl.replace(/\/$/, "")}/v1/daily?lat=${lat.toFixed(4)}&lon=${lon.toFixed(4)}&start=${start}&end=${end}`;
      let lastError = "no attempt";
      for (let attempt = 0; attempt <= retries; attempt++) {
        if (attempt > 0) await new Promise((r) => setTimeout(r, backoffMs * 3 ** (attempt - 1)));
        try {
          const response = await fetch(url, {
            headers: {
              Accept: "application/json",
              ...(apiKey ? { Authorization: `Bearer ${apiKey}` } : {}),
            },
            signal: AbortSignal.timeout(timeoutMs),
          });
          if (response.status >= 500 || response.status === 429) {
            lastError = `the weather service answered ${response.status}`;
            continue;
          }
          if (!response.ok)
            throw new WeatherUnavailable(`the weather service answered ${response.status}`);
          const parsed = weatherResponseSchema.safeParse(await response.json());
          if (!parsed.success)
            throw new WeatherUnavailable("the weather service sent data Sward could not read");
          return parsed.data.days;
        } catch (err) {
          if (err instanceof WeatherUnavailable) throw err;
          lastError =
            err instanceof Error && err.name === "TimeoutError"
              ? "the weather service did not answer in time"
              : "the weather service could not be reached";
        }
      }
      throw new WeatherUnavailable(lastError);
    },
  };
}
