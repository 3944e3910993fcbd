// The property's weather: the last 14 days and the forecast, with reference ET, turf water use,
// water balance and growing degree days — and a plain note when the service is unavailable.
import { CloudOff } from "lucide-react";

import { formatDate } from "@/lib/dates";
import type { PropertyWeather } from "@/lib/weather/dto";

const f = (x: number, d = 2) => x.toFixed(d);

export function WeatherPanel({ weather }: { weather: PropertyWeather }) {
  const past = weather.days.filter((d) => !d.isForecast && d.date <= weather.today);
  const last = past[past.length - 1];
  return (
    <section aria-labelledby="weather-title" className="space-y-3">
      <h2 id="weather-title" className="text-2xl font-bold">
        Weather and water
      </h2>
      {weather.status !== "ok" ? (
        <p
          role="status"
          className="flex items-center gap-2 rounded-lg border border-line bg-sun-tint p-3"
        >
          <CloudOff className="size-5 text-sun" aria-hidden="true" />
          {weather.message ?? "Weather unavailable."}{" "}
          {weather.days.length ? "Showing the last values Sward has." : ""}
        </p>
      ) : null}
      {last ? (
        <dl className="grid grid-cols-2 gap-3 sm:grid-cols-4">
          <div className="rounded-xl border border-line bg-card p-3">
            <dt className="text-sm text-muted">Water balance, 7 days</dt>
            <dd className={`text-xl font-bold ${last.balance7In < 0 ? "text-clay" : "text-rain"}`}>
              {last.balance7In >= 0 ? "+" : "−"}
              {f(Math.abs(last.balance7In))} in
            </dd>
          </div>
          <div className="rounded-xl border border-line bg-card p-3">
            <dt className="text-sm text-muted">Water balance, 14 days</dt>
            <dd className={`text-xl font-bold ${last.balance14In < 0 ? "text-clay" : "text-rain"}`}>
              {last.balance14In >= 0 ? "+" : "−"}
              {f(Math.abs(last.balance14In))} in
            </dd>
          </div>
          <div className="rounded-xl border border-line bg-card p-3">
            <dt className="text-sm text-muted">GDD since January 1 (base 50 °F)</dt>
            <dd className="text-xl font-bold">
              {weather.gddSinceJan1F === null
                ? "—"
                : Math.round(weather.gddSinceJan1F).toLocaleString("en-US")}{" "}
              °F·days
            </dd>
          </div>
          <div className="rounded-xl border border-line bg-card p-3">
            <dt className="text-sm text-muted">5-day means</dt>
            <dd className="text-xl font-bold">
              {Math.round(last.tmean5dF)} °F ·{" "}
              {last.rhMean5dPct === null ? "—" : Math.round(last.rhMean5dPct)} % RH
            </dd>
          </div>
        </dl>
      ) : null}
      {weather.days.length ? (
        <div
          className="overflow-x-auto rounded-xl border border-line bg-card"
          role="region"
          aria-label="Daily weather and water (scrolls sideways)"
          tabIndex={0}
        >
          <table className="w-full min-w-[44rem] text-left text-sm">
            <caption className="p-3 text-left text-muted">
              Balance = rain + watering − turf use (Kc {weather.kc.toFixed(2)} × reference ET,
              FAO-56 Penman–Monteith; Hargreaves where humidity, wind or sun are missing).
            </caption>
            <thead className="border-y border-line bg-paper">
              <tr>
                <th scope="col" className="p-2">
                  Day
                </th>
                <th scope="col" className="p-2">
                  High / low
                </th>
                <th scope="col" className="p-2">
                  Humidity
                </th>
                <th scope="col" className="p-2">
                  Rain
                </th>
                <th scope="col" className="p-2">
                  Watering
                </th>
                <th scope="col" className="p-2">
                  Reference ET
                </th>
                <th scope="col" className="p-2">
                  Turf use
                </th>
                <th scope="col" className="p-2">
                  GDD
                </th>
              </tr>
            </thead>
            <tbody>
              {weather.days.map((d) => (
                <tr
                  key={d.date}
                  className={`border-b border-line last:border-0 ${d.isForecast ? "bg-rain-tint/40 italic" : ""}`}
                >
                  <th scope="row" className="p-2 font-semibold">
                    {formatDate(d.date)}
                    {d.isForecast ? " (forecast)" : ""}
                  </th>
                  <td className="p-2">
                    {Math.round(d.tmaxF)} / {Math.round(d.tminF)} °F
                  </td>
                  <td className="p-2">
                    {d.rhMeanPct === null ? "—" : `${Math.round(d.rhMeanPct)} %`}
                  </td>
                  <td className="p-2">{f(d.rainIn)} in</td>
                  <td className="p-2">{d.wateringIn ? `${f(d.wateringIn)} in` : "—"}</td>
                  <td className="p-2">
                    {f(d.et0In)} in{d.et0Method === "hargreaves" ? " (H)" : ""}
                  </td>
                  <td className="p-2">{f(d.turfUseIn)} in</td>
                  <td className="p-2">{Math.round(d.gddF)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
