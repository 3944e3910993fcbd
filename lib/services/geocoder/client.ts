// The geocoder client: the Census Bureau's one-line-address endpoint (contract.ts) over plain
// fetch, with a timeout and zod validation, built like the weather client. A person is waiting
// (the manager's "Find the location from the address"), so one try and a short timeout; anything
// unexpected becomes a GeocoderUnavailable error in plain words, never a crash.
import {
  CENSUS_BENCHMARK,
  CENSUS_ONELINE_PATH,
  censusErrorSchema,
  censusResponseSchema,
  matchesFromCensus,
  type AddressMatch,
} from "./contract";

export class GeocoderUnavailable extends Error {
  constructor(message: string) {
    super(message);
    this.name = "GeocoderUnavailable";
  }
}

export interface Geocoder {
  /** The service's matches for a one-line US address; an empty list when nothing matched. */
  findAddress(oneLine: string): Promise<AddressMatch[]>;
}

/** The query of one request. */
function censusQuery(address: string): string {
  return new URLSearchParams({ address, benchmark: CENSUS_BENCHMARK, format: "json" }).toString();
}

export function censusGeocoder(options: {
  /** The service's origin, e.g. https://geocoding.geo.census.gov */
  baseUrl: string;
  timeoutMs?: number;
}): Geocoder {
  const { timeoutMs = 5000 } = options;
  const endpoint = `${options.baseUrl.replace(/\/$/, "")}${CENSUS_ONELINE_PATH}`;
  return {
    async findAddress(oneLine) {
      let response: Response;
      try {
        response = await fetch(`${endpoint}?${censusQuery(oneLine)}`, {
          headers: { Accept: "application/json" },
          signal: AbortSignal.timeout(timeoutMs),
        });
      } catch (err) {
        throw new GeocoderUnavailable(
          err instanceof Error && err.name === "TimeoutError"
            ? "the address lookup service did not answer in time"
            : "the address lookup service could not be reached",
        );
      }
      const body: unknown = await response.json().catch(() => null);
      if (!response.ok) {
        const reason = censusErrorSchema.safeParse(body);
        throw new GeocoderUnavailable(
          `the address lookup service answered ${response.status}${reason.success && reason.data.errors[0] ? ` (${reason.data.errors[0]})` : ""}`,
        );
      }
      const parsed = censusResponseSchema.safeParse(body);
      if (!parsed.success)
        throw new GeocoderUnavailable("the address lookup service sent data Sward could not read");
      return matchesFromCensus(parsed.data);
    },
  };
}
