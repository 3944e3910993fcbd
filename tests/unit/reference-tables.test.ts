// The grass-species reference table against its published sources, and the demo scenario's
// own consistency (invented data, .test e-mails, the sizes the demo promises).
import { describe, expect, it } from "vitest";

import { demoCompany, demoScenario, otherCompany } from "@/fixtures/demo/scenario";
import { findGrassSpecies, grassSpecies } from "@/lib/reference/grass-species";

describe("grass species: home-lawn height of cut (in), from extension tables", () => {
  // University of Kentucky AGR-209, Table 1 "Mowing heights for Kentucky lawns" (as reproduced by
  // UK extension; the PDF was not read).
  const kentucky: Record<string, [number, number]> = {
    tall_fescue: [2, 3.5],
    kentucky_bluegrass: [2, 3.5],
    perennial_ryegrass: [1.5, 2.5],
    bermudagrass: [1, 2],
  };
  // UF/IFAS "Mowing Your Florida Lawn" (EDIS LH028), optimal mowing heights (as reproduced by
  // UF/IFAS county extension; the EDIS page was not read).
  const florida: Record<string, [number, number]> = {
    bahiagrass: [3, 4],
    centipedegrass: [1.5, 2],
    st_augustinegrass: [2.5, 4],
    zoysiagrass: [1, 3],
  };
  // University of Maine Cooperative Extension lawn grass table: red (creeping) fescue.
  const maine: Record<string, [number, number]> = { fine_fescue: [2, 2.5] };
  it.each([
    ...Object.entries(kentucky).map(([k, r]) => [k, r, /Kentucky AGR-209/] as const),
    ...Object.entries(florida).map(([k, r]) => [k, r, /UF\/IFAS/] as const),
    ...Object.entries(maine).map(([k, r]) => [k, r, /University of Maine/] as const),
  ])("%s", (key, [min, max], source) => {
    const h = findGrassSpecies(key)!.heightOfCutIn;
    expect(h).toMatchObject({ min, max });
    expect(h.source).toMatch(source);
  });
  it("every species is covered, and no home-lawn minimum is an all-use (golf) minimum", () => {
    expect(
      new Set([...Object.keys(kentucky), ...Object.keys(florida), ...Object.keys(maine)]),
    ).toEqual(new Set(grassSpecies.map((s) => s.key)));
    // The University of Tennessee all-use table Sward used before: tall fescue from 1 in,
    // perennial ryegrass from 0.25 in, Kentucky bluegrass from 0.75 in.
    expect(findGrassSpecies("tall_fescue")!.heightOfCutIn.min).toBeGreaterThan(1);
    expect(findGrassSpecies("perennial_ryegrass")!.heightOfCutIn.min).toBeGreaterThan(0.25);
    expect(findGrassSpecies("kentucky_bluegrass")!.heightOfCutIn.min).toBeGreaterThan(0.75);
  });
});

describe("grass species: annual nitrogen (lb N / 1,000 ft² / yr)", () => {
  // Source: University of Illinois (1995) for cool-season species.
  const illinois: Record<string, [number, number]> = {
    fine_fescue: [1, 3],
    tall_fescue: [2, 4],
    perennial_ryegrass: [2, 4],
    kentucky_bluegrass: [1, 4],
  };
  it.each(Object.entries(illinois))("%s (Illinois 1995)", (key, [min, max]) => {
    expect(findGrassSpecies(key)?.annualNitrogenLb).toMatchObject({ min, max });
  });

  // Source: UF/IFAS, north / central / south Florida.
  const florida: Record<string, [[number, number], [number, number], [number, number]]> = {
    bahiagrass: [
      [2, 3],
      [2, 4],
      [2, 4],
    ],
    bermudagrass: [
      [3, 5],
      [4, 6],
      [5, 7],
    ],
    centipedegrass: [
      [1, 2],
      [2, 3],
      [2, 3],
    ],
    st_augustinegrass: [
      [2, 4],
      [2, 5],
      [4, 6],
    ],
    zoysiagrass: [
      [3, 5],
      [3, 6],
      [4, 6],
    ],
  };
  it.each(Object.entries(florida))("%s (UF/IFAS by region)", (key, [north, central, south]) => {
    const s = findGrassSpecies(key)!;
    expect(s.annualNitrogenByRegion?.north_florida).toEqual({ min: north[0], max: north[1] });
    expect(s.annualNitrogenByRegion?.central_florida).toEqual({ min: central[0], max: central[1] });
    expect(s.annualNitrogenByRegion?.south_florida).toEqual({ min: south[0], max: south[1] });
    expect(s.annualNitrogenLb).toMatchObject({ min: central[0], max: central[1] });
  });

  it("every species names a source for each range, and ranges are ordered", () => {
    for (const s of grassSpecies) {
      expect(s.heightOfCutIn.source.length).toBeGreaterThan(10);
      expect(s.annualNitrogenLb.source.length).toBeGreaterThan(10);
      expect(s.heightOfCutIn.min).toBeLessThan(s.heightOfCutIn.max);
      expect(s.annualNitrogenLb.min).toBeLessThan(s.annualNitrogenLb.max);
    }
  });
});

describe("demo scenario", () => {
  it("has the promised shape: 1 manager, 2 technicians, 3 homeowners, 6 properties of 2–4 zones", () => {
    const roles = demoCompany.people.map((p) => p.role);
    expect(roles.filter((r) => r === "manager")).toHaveLength(1);
    expect(roles.filter((r) => r === "technician")).toHaveLength(2);
    expect(roles.filter((r) => r === "homeowner")).toHaveLength(3);
    expect(demoCompany.properties).toHaveLength(6);
    for (const p of demoCompany.properties) {
      expect(p.zones.length).toBeGreaterThanOrEqual(2);
      expect(p.zones.length).toBeLessThanOrEqual(4);
    }
    expect(otherCompany.properties).toHaveLength(1);
  });

  it("uses .test e-mails, known species, and locations within one region per company", () => {
    for (const company of demoScenario) {
      for (const person of company.people) expect(person.email).toMatch(/@[a-z.]+\.test$/);
      const lats = company.properties.map((p) => p.latitude);
      const lons = company.properties.map((p) => p.longitude);
      expect(Math.max(...lats) - Math.min(...lats)).toBeLessThan(0.5);
      expect(Math.max(...lons) - Math.min(...lons)).toBeLessThan(0.5);
      for (const p of company.properties)
        for (const z of p.zones) expect(findGrassSpecies(z.grassSpecies)).toBeDefined();
    }
  });
});
