// The local fake weather service (demo and tests): answers Open-Meteo's forecast
// (/v1/forecast) and historical-weather (/v1/archive) endpoints in their JSON shape
// (lib/services/weather/contract.ts) on 127.0.0.1 from deterministic data
// (fixtures/demo/weather-days.ts). Like the real service it refuses unknown variables and dates
// outside an endpoint's range with 400 and `{ error: true, reason }`.
// `tsx tests/harness/weather-fake.ts [port]`.
import http from "node:http";

import { fakeOpenMeteo, fakeUtcOffsetSeconds } from "@/fixtures/demo/weather-days";
import { addDays, isIsoDate } from "@/lib/dates";
import { localToday, OPEN_METEO_DAILY, OPEN_METEO_HOURLY } from "@/lib/services/weather/contract";

/** The forecast endpoint's range (Open-Meteo: past_days up to 92, forecast_days up to 16). */
const FORECAST_PAST = 92;
const FORECAST_AHEAD = 15;

export function startFakeWeather(port: number): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    const url = new URL(req.url ?? "/", "http://127.0.0.1");
    const send = (status: number, body: unknown) => {
      res.writeHead(status, { "Content-Type": "application/json" });
      res.end(JSON.stringify(body));
    };
    const refuse = (reason: string) => send(400, { error: true, reason });
    if (url.pathname === "/health") return send(200, { ok: true });
    const archive = url.pathname === "/v1/archive";
    if (!archive && url.pathname !== "/v1/forecast")
      return send(404, { error: true, reason: "Not Found" });
    const q = url.searchParams;
    const lat = Number(q.get("latitude"));
    const lon = Number(q.get("longitude"));
    if (!q.get("latitude") || !Number.isFinite(lat) || Math.abs(lat) > 90)
      return refuse("Latitude must be in range of -90 to 90°.");
    if (!q.get("longitude") || !Number.isFinite(lon) || Math.abs(lon) > 180)
      return refuse("Longitude must be in range of -180 to 180°.");
    const start = q.get("start_date") ?? "";
    const end = q.get("end_date") ?? "";
    if (!isIsoDate(start) || !isIsoDate(end))
      return refuse("Invalid date format for start_date or end_date");
    if (end < start) return refuse("End-date must be larger or equals than start-date");
    for (const [name, known] of [
      ["hourly", OPEN_METEO_HOURLY],
      ["daily", OPEN_METEO_DAILY],
    ] as const) {
      const unknown = (q.get(name) ?? "")
        .split(",")
        .filter((v) => v && !(known as readonly string[]).includes(v));
      if (unknown.length)
        return refuse(
          `Cannot initialize ${name} variable from invalid String value ${unknown[0]}.`,
        );
    }
    if (q.get("wind_speed_unit") !== "ms")
      return refuse("This fake serves wind_speed_unit=ms only.");
    const today = localToday(fakeUtcOffsetSeconds(lon), Date.now());
    if (
      archive
        ? start < "1940-01-01" || end > today
        : start < addDays(today, -FORECAST_PAST) || end > addDays(today, FORECAST_AHEAD)
    )
      return refuse(`Parameter 'start_date' or 'end_date' is out of allowed range`);
    if (Date.parse(end) - Date.parse(start) > 800 * 86_400_000)
      return refuse("Too many days requested");
    const answer = fakeOpenMeteo(lat, lon, start, end, { archive, today });
    // Like the real service: only the blocks asked for (the monthly normals ask for daily only).
    if (!q.get("hourly")) {
      const { hourly: _hourly, ...daily } = answer;
      return send(200, daily);
    }
    send(200, answer);
  });
  return new Promise((resolve) => server.listen(port, "127.0.0.1", () => resolve(server)));
}

if (process.argv[1]?.endsWith("weather-fake.ts")) {
  const port = Number(process.argv[2] ?? 3999);
  await startFakeWeather(port);
  console.log(`weather fake listening on http://127.0.0.1:${port}`);
}
