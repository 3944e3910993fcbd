// The local fake geocoder (demo and tests): answers the US Census Bureau geocoder's one-line-address
// endpoint (GET /geocoder/locations/onelineaddress) in its JSON shape
// (lib/services/geocoder/contract.ts) on 127.0.0.1, from the invented addresses of
// fixtures/demo/geocoder-addresses.ts; any other address gets an empty list of matches, as the real
// service answers. Like the real one it refuses a request without an address or with another
// benchmark (400, `{ errors: [...], status: "400" }`).
// `tsx tests/harness/geocoder-fake.ts [port]`.
import http from "node:http";

import { fakeCensusMatches } from "@/fixtures/demo/geocoder-addresses";
import { CENSUS_BENCHMARK, CENSUS_ONELINE_PATH } from "@/lib/services/geocoder/contract";

export function startFakeGeocoder(port: number): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "Content-Type": "application/json" });
      res.end(JSON.stringify(body));
    };
    const refuse = (message: string) => send(400, { errors: [message], status: "400" });
    if (url.pathname === "/health") return send(200, { ok: true });
    if (url.pathname !== CENSUS_ONELINE_PATH)
      return send(404, { errors: ["Not Found"], status: "404" });
    const q = url.searchParams;
    const address = q.get("address")?.trim() ?? "";
    if (!address) return refuse("Address cannot be empty and cannot exceed 100 characters");
    if (address.length > 100)
      return refuse("Address cannot be empty and cannot exceed 100 characters");
    if (q.get("benchmark") !== CENSUS_BENCHMARK) return refuse("Invalid benchmark");
    if (q.get("format") !== "json") return refuse("This fake answers format=json only");
    send(200, {
      result: {
        input: {
          address: { address },
          benchmark: {
            id: "4",
            benchmarkName: CENSUS_BENCHMARK,
            benchmarkDescription: "Public Address Ranges - Current Benchmark",
            isDefault: true,
          },
        },
        addressMatches: fakeCensusMatches(address),
      },
    });
  });
  return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve(server)));
}

if (process.argv[1]?.endsWith("geocoder-fake.ts")) {
  const port = Number(process.argv[2] ?? 3998);
  await startFakeGeocoder(port);
  console.log(`geocoder fake listening on http://127.0.0.1:${port}`);
}
