// The local fake weather service (demo and tests): serves lib/services/weather/contract.ts on
// 127.0.0.1 from deterministic data. `tsx tests/harness/weather-fake.ts [port]`.
import http from "node:http";

import { fakeWeatherDay } from "@/fixtures/demo/weather-days";
import { addDays, todayIn } from "@/lib/dates";

export function startFakeWeather(port: number): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "Content-Type": "application/json" });
      res.end(JSON.stringify(body));
    };
    if (url.pathname === "/health") return send(200, { ok: true });
    if (url.pathname !== "/v1/daily") return send(404, { error: "not found" });
    const lat = Number(url.searchParams.get("lat"));
    const lon = Number(url.searchParams.get("lon"));
    const start = url.searchParams.get("start") ?? "";
    const end = url.searchParams.get("end") ?? "";
    if (
      !Number.isFinite(lat) ||
      !Number.isFinite(lon) ||
      !/^\d{4}-\d{2}-\d{2}$/.test(start) ||
      !/^\d{4}-\d{2}-\d{2}$/.test(end) ||
      end < start
    )
      return send(422, { error: "bad query" });
    const today = todayIn("UTC");
    const days = [];
    for (let d = start; d <= end && days.length < 800; d = addDays(d, 1))
      days.push(fakeWeatherDay(lat, lon, d, today));
    send(200, { location: { lat, lon }, days });
  });
  return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve(server)));
}

if (process.argv[1]?.endsWith("weather-fake.ts")) {
  const port = Number(process.argv[2] ?? 3999);
  await startFakeWeather(port);
  console.log(`weather fake listening on http://127.0.0.1:${port}`);
}
