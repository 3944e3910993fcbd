// The local fake routing service (demo and tests): answers the OSRM engine's Table API
// (GET /table/v1/driving/{lon},{lat};…?annotations=distance,duration, lib/services/routing/contract.ts)
// on 127.0.0.1 in its JSON shape, with road distance = great-circle distance × the US circuity
// factor 1.2 (Ballou, Rahardja & Sakai 2002) and driving time at our assumed 30 mph — the same
// estimate Sward falls back on (lib/routing/great-circle.ts), so the fake's figures can be checked
// by hand. Like the engine, it refuses a malformed coordinate list (400, `{ code: "InvalidQuery" }`)
// and answers one more kind of failure on purpose: a coordinate at latitude 89.9 or beyond
// ("no road there") gets null cells, as the engine answers for points it cannot connect.
// `tsx tests/harness/routing-fake.ts [port]`.
import http from "node:http";

import { estimatedMatrix, type LatLng } from "@/lib/routing/great-circle";
import { OSRM_TABLE_PATH } from "@/lib/services/routing/contract";

/** The engine's default limit on a table's points (osrm-routed --max-table-size; from memory). */
const MAX_POINTS = 100;
const NUMBER = /^-?\d{1,3}(\.\d+)?$/;

function parseCoordinates(text: string): LatLng[] | null {
  const pairs = text.split(";");
  if (pairs.length < 1 || pairs.length > MAX_POINTS) return null;
  const points: LatLng[] = [];
  for (const pair of pairs) {
    const [lon, lat, extra] = pair.split(",");
    if (extra !== undefined || !lon || !lat || !NUMBER.test(lon) || !NUMBER.test(lat)) return null;
    const point = { longitude: Number(lon), latitude: Number(lat) };
    if (Math.abs(point.latitude) > 90 || Math.abs(point.longitude) > 180) return null;
    points.push(point);
  }
  return points;
}

export function startFakeRouting(port: number): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "Content-Type": "application/json" });
      res.end(JSON.stringify(body));
    };
    if (url.pathname === "/health") return send(200, { ok: true });
    if (!url.pathname.startsWith(OSRM_TABLE_PATH))
      return send(400, { code: "InvalidUrl", message: "URL string malformed close to position 1" });
    const points = parseCoordinates(decodeURIComponent(url.pathname.slice(OSRM_TABLE_PATH.length)));
    if (!points) return send(400, { code: "InvalidQuery", message: "Query string malformed" });
    const annotations = (url.searchParams.get("annotations") ?? "duration").split(",");
    const { meters, seconds } = estimatedMatrix(points);
    const unreachable = (i: number) => Math.abs(points[i]!.latitude) >= 89.9;
    const round = (m: number[][]) =>
      m.map((row, i) =>
        row.map((v, j) =>
          i !== j && (unreachable(i) || unreachable(j)) ? null : Math.round(v * 10) / 10,
        ),
      );
    const waypoints = points.map((p) => ({
      hint: "",
      distance: 0,
      name: "",
      location: [p.longitude, p.latitude],
    }));
    send(200, {
      code: "Ok",
      ...(annotations.includes("duration") ? { durations: round(seconds) } : {}),
      ...(annotations.includes("distance") ? { distances: round(meters) } : {}),
      sources: waypoints,
      destinations: waypoints,
    });
  });
  return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve(server)));
}

if (process.argv[1]?.endsWith("routing-fake.ts")) {
  const port = Number(process.argv[2] ?? 3997);
  await startFakeRouting(port);
  console.log(`routing fake listening on http://127.0.0.1:${port}`);
}
