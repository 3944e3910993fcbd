// The routing client: OSRM's Table API (contract.ts) over plain fetch, with a timeout and zod
// validation, built like the geocoder client. A technician is waiting on Today, so one try and a
// short timeout; when the service is not configured, fails or answers something Sward cannot read,
// `travelMatrix` falls back to the great-circle estimate (lib/routing/great-circle.ts) and says so,
// so the day's route is always there — shown as "estimated".
import { estimatedMatrix, type LatLng, type TravelMatrix } from "@/lib/routing/great-circle";

import { matrixFromTable, osrmErrorSchema, osrmTableSchema, tableRequestPath } from "./contract";

class RoutingUnavailable extends Error {
  constructor(message: string) {
    super(message);
    this.name = "RoutingUnavailable";
  }
}

export interface RoutingService {
  /** Road distances and driving times between every pair of `points`. */
  table(points: readonly LatLng[]): Promise<{ matrix: TravelMatrix; estimated: boolean }>;
}

export function osrmRouting(options: {
  /** The service's origin (and path prefix, if any), e.g. https://routing.example.com */
  baseUrl: string;
  /** Sent as a bearer token when the hosted service wants one. */
  apiKey?: string;
  timeoutMs?: number;
}): RoutingService {
  const { timeoutMs = 2500 } = options;
  const base = options.baseUrl.replace(/\/$/, "");
  return {
    async table(points) {
      let response: Response;
      try {
        response = await fetch(`${base}${tableRequestPath(points)}`, {
          headers: {
            Accept: "application/json",
            ...(options.apiKey ? { Authorization: `Bearer ${options.apiKey}` } : {}),
          },
          signal: AbortSignal.timeout(timeoutMs),
        });
      } catch (err) {
        throw new RoutingUnavailable(
          err instanceof Error && err.name === "TimeoutError"
            ? "the routing service did not answer in time"
            : "the routing service could not be reached",
        );
      }
      const body: unknown = await response.json().catch(() => null);
      const parsed = osrmTableSchema.safeParse(body);
      if (!response.ok || !parsed.success) {
        const error = osrmErrorSchema.safeParse(body);
        throw new RoutingUnavailable(
          `the routing service answered ${response.status}${error.success ? ` (${error.data.code})` : ""}`,
        );
      }
      const result = matrixFromTable(parsed.data, points);
      if (!result)
        throw new RoutingUnavailable("the routing service sent a table of the wrong size");
      return result;
    },
  };
}

export interface DayMatrix {
  matrix: TravelMatrix;
  /** True when some or all of it is the great-circle estimate rather than the service's roads. */
  estimated: boolean;
  /** Why the service's figures are not used, in plain words (null when they are). */
  reason: string | null;
}

/** The service's matrix, or the estimate when there is no service or it fails. Never throws. */
export async function travelMatrix(
  service: RoutingService | null,
  points: readonly LatLng[],
): Promise<DayMatrix> {
  if (points.length < 2) return { matrix: estimatedMatrix(points), estimated: false, reason: null };
  if (!service)
    return {
      matrix: estimatedMatrix(points),
      estimated: true,
      reason: "no routing service is set up",
    };
  try {
    const { matrix, estimated } = await service.table(points);
    return {
      matrix,
      estimated,
      reason: estimated ? "the routing service found no road between some stops" : null,
    };
  } catch (err) {
    return {
      matrix: estimatedMatrix(points),
      estimated: true,
      reason: err instanceof RoutingUnavailable ? err.message : "the routing service failed",
    };
  }
}
