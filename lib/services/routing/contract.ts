// The Table service of the open-source routing engine OSRM (Project OSRM's HTTP API, v5), as Sward
// reads it — the same API answers from a self-hosted engine or from a hosted service that speaks it:
//   GET {ROUTING_BASE_URL}/table/v1/driving/{lon},{lat};{lon},{lat}…?annotations=distance,duration
//
// The answer, as the project's HTTP API document (docs/http.md, "Table service") describes it:
// `code` is "Ok" on success, otherwise an error code ("InvalidQuery", "NoTable", …) with a
// `message`; `durations[i][j]` is the travel time in seconds from the i-th to the j-th point,
// row-major; `distances[i][j]` the road distance in meters (returned when `annotations` asks for
// it, since OSRM 5.18 — the version is from memory); `sources` and `destinations` list the points
// as snapped to the road network (Waypoint objects: `location` [longitude, latitude], `name`,
// `distance` from the input point in meters). A pair the engine cannot connect is null.
// Only the fields Sward uses are required; anything else is ignored.
import { z } from "zod";

import { estimatedMatrix, type LatLng, type TravelMatrix } from "@/lib/routing/great-circle";

export const OSRM_TABLE_PATH = "/table/v1/driving/";

/** The path and query of a Table request for `points` (OSRM wants longitude first). */
export function tableRequestPath(points: readonly LatLng[]): string {
  const coordinates = points
    .map((p) => `${p.longitude.toFixed(6)},${p.latitude.toFixed(6)}`)
    .join(";");
  return `${OSRM_TABLE_PATH}${coordinates}?annotations=distance,duration`;
}

const cell = z.number().nonnegative().nullable();

const waypointSchema = z
  .object({ location: z.tuple([z.number(), z.number()]), name: z.string().optional() })
  .loose();

export const osrmTableSchema = z
  .object({
    code: z.literal("Ok"),
    durations: z.array(z.array(cell)),
    distances: z.array(z.array(cell)),
    sources: z.array(waypointSchema).optional(),
    destinations: z.array(waypointSchema).optional(),
  })
  .loose();
export type OsrmTable = z.infer<typeof osrmTableSchema>;

export const osrmErrorSchema = z
  .object({ code: z.string(), message: z.string().optional() })
  .loose();

/**
 * The matrix of an answer for `points`. A pair the engine could not connect (null) is filled with
 * the great-circle estimate, and the whole matrix is then marked estimated. Null when the answer's
 * size does not match the request.
 */
export function matrixFromTable(
  table: OsrmTable,
  points: readonly LatLng[],
): { matrix: TravelMatrix; estimated: boolean } | null {
  const n = points.length;
  const square = (m: (number | null)[][]) => m.length === n && m.every((row) => row.length === n);
  if (!square(table.durations) || !square(table.distances)) return null;
  let fallback: TravelMatrix | null = null;
  const fill = (value: number | null, i: number, j: number, of: keyof TravelMatrix) => {
    if (value !== null) return value;
    fallback ??= estimatedMatrix(points);
    return fallback[of][i]![j]!;
  };
  const matrix = {
    meters: table.distances.map((row, i) => row.map((v, j) => fill(v, i, j, "meters"))),
    seconds: table.durations.map((row, i) => row.map((v, j) => fill(v, i, j, "seconds"))),
  };
  return { matrix, estimated: fallback !== null };
}
