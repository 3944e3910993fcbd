// The local fake of the hosted map service (demo and tests): answers a MapLibre style document
// (style specification v8) and the GeoJSON it draws, on 127.0.0.1, with no outside network. The
// base is plain on purpose: a background, county outlines and state outlines from the U.S. Census
// Bureau's cartographic boundary files as packaged by `us-atlas` (TopoJSON, 1:10,000,000),
// turned into GeoJSON lines with `topojson-client` (each shared border once: `mesh`).
// Like a hosted service it wants its key: a request without `key` is 401.
// `tsx tests/harness/map-tiles-fake.ts [port]`.
import { readFileSync } from "node:fs";
import http from "node:http";
import { createRequire } from "node:module";
import { gzipSync } from "node:zlib";
import { mesh } from "topojson-client";

/** The path of the style the demo and tests configure (MAP_STYLE_URL, with `{key}`). */
export const FAKE_STYLE_PATH = "/styles/plain/style.json";

const require = createRequire(import.meta.url);
type Topology = Parameters<typeof mesh>[0];
type Collection = NonNullable<Parameters<typeof mesh>[1]>;
const readTopology = (file: string) =>
  JSON.parse(readFileSync(require.resolve(`us-atlas/${file}`), "utf8")) as Topology & {
    objects: { states: Collection; counties: Collection };
  };

function outlines() {
  const counties = readTopology("counties-10m.json");
  const asFeature = (geometry: unknown, name: string) =>
    gzipSync(JSON.stringify({ type: "Feature", properties: { name }, geometry }));
  return {
    // Borders between two counties (a ≠ b), and every state border including the coast (a = b too).
    counties: asFeature(
      mesh(counties, counties.objects.counties, (a, b) => a !== b),
      "county lines",
    ),
    states: asFeature(mesh(counties, counties.objects.states), "state lines"),
  };
}

function startFakeMapTiles(port: number): Promise<http.Server> {
  const data = outlines();
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const origin = `http://${req.headers.host ?? `127.0.0.1:${port}`}`;
    // The page's origin differs from this service's: a hosted map service answers with CORS.
    const cors = { "Access-Control-Allow-Origin": "*" };
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "Content-Type": "application/json", ...cors });
      res.end(JSON.stringify(body));
    };
    if (url.pathname === "/health") return send(200, { ok: true });
    const key = url.searchParams.get("key");
    if (!key) return send(401, { message: "Missing the key parameter" });
    const q = `?key=${encodeURIComponent(key)}`;
    if (url.pathname === FAKE_STYLE_PATH)
      return send(200, {
        version: 8,
        name: "Plain base (local fake)",
        sources: {
          counties: { type: "geojson", data: `${origin}/data/counties.geojson${q}` },
          states: { type: "geojson", data: `${origin}/data/states.geojson${q}` },
        },
        layers: [
          { id: "background", type: "background", paint: { "background-color": "#eef0e6" } },
          {
            id: "county-lines",
            type: "line",
            source: "counties",
            paint: { "line-color": "#b9b29f", "line-width": 0.8 },
          },
          {
            id: "state-lines",
            type: "line",
            source: "states",
            paint: { "line-color": "#6f6a5c", "line-width": 1.6 },
          },
        ],
      });
    const file =
      url.pathname === "/data/counties.geojson"
        ? data.counties
        : url.pathname === "/data/states.geojson"
          ? data.states
          : null;
    if (!file) return send(404, { message: "Not Found" });
    res.writeHead(200, {
      "Content-Type": "application/geo+json",
      "Content-Encoding": "gzip",
      "Cache-Control": "public, max-age=3600",
      ...cors,
    });
    res.end(file);
  });
  return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve(server)));
}

if (process.argv[1]?.endsWith("map-tiles-fake.ts")) {
  const port = Number(process.argv[2] ?? 3996);
  await startFakeMapTiles(port);
  console.log(`map tiles fake listening on http://127.0.0.1:${port}`);
}
