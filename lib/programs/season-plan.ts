// A property's season plan for this year: its program's rounds with their windows and each
// zone's nitrogen per round, from the monthly normals of the weather service (asked before
// anything else; when it cannot answer, fixed targets stand and the growth-potential rounds say
// why they are not planned).
import "server-only";

import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";
import { WeatherUnavailable, type WeatherProvider } from "@/lib/services/weather/provider";

import type { ProgramPlanDto } from "./dto";
import { planZones } from "./plan";
import { getPlanFacts } from "./queries";

export async function getSeasonPlan(
  actor: Actor,
  propertyId: string,
  weather: WeatherProvider | null,
): Promise<ProgramPlanDto> {
  const facts = await getPlanFacts(actor, propertyId);
  const year = Number(todayIn(facts.property.timeZone).slice(0, 4));
  let normals: { monthlyMeanC: number[]; years: [number, number] } | null = null;
  let weatherProblem: string | null = null;
  const needsNormals = facts.rounds.some(
    (r) =>
      r.window.kind !== "dates" ||
      r.granular.target === "growth_potential" ||
      r.liquid.target === "growth_potential",
  );
  if (needsNormals) {
    if (!weather) weatherProblem = "No weather service is set up.";
    else
      try {
        normals = await weather.normals(facts.property.latitude, facts.property.longitude);
      } catch (err) {
        if (!(err instanceof WeatherUnavailable)) throw err;
        weatherProblem = `The weather service could not give the monthly normals: ${err.message}.`;
      }
  }
  const { windows, zones } = planZones({
    year,
    grassSeason: facts.program?.grassSeason ?? "cool",
    rounds: facts.rounds,
    normals: normals?.monthlyMeanC ?? null,
    ruleSet: facts.ruleSet,
    zones: facts.program ? facts.zones : [],
    products: facts.products,
  });
  return {
    propertyId,
    year,
    program: facts.program,
    weatherProblem,
    normalsYears: normals?.years ?? null,
    ruleSetName: facts.ruleSet?.name ?? null,
    rounds: facts.rounds.map((r, i) => ({
      position: r.position,
      kind: r.kind,
      start: windows[i]!.start,
      end: windows[i]!.end,
      estimated: windows[i]!.estimated,
      window: r.window,
    })),
    zones,
  };
}
