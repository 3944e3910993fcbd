// The geocoder client (lib/services/geocoder) against the local fake of the US Census Bureau's
// one-line-address endpoint (tests/harness/geocoder-fake.ts), against an answer in the Bureau's
// published shape, and against a service that misbehaves: every failure is a GeocoderUnavailable
// in plain words. Servers here listen on 127.0.0.1 only.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { parseServiceEnv } from "@/lib/env";
import { createServices } from "@/lib/services";
import { censusGeocoder, GeocoderUnavailable } from "@/lib/services/geocoder/client";
import {
  censusResponseSchema,
  matchesFromCensus,
  oneLineAddress,
} from "@/lib/services/geocoder/contract";

import { startFakeGeocoder } from "../harness/geocoder-fake";

const origin = (s: Server) => `http://127.0.0.1:${(s.address() as AddressInfo).port}`;

describe("an answer in the Census Bureau's shape", () => {
  // The columns and values the censusxy R package's reference page prints for its one-line call
  // on "20 N Grand Blvd, St Louis, MO 63108" (a live answer when that page was built): x -90.2332,
  // y 38.63586, zip 63103, streetName GRAND, city SAINT LOUIS, preDirection N, tigerLine side R,
  // tigerLineId 107607932. The matchedAddress string and the state component are written from
  // memory of the service's format ("NUMBER STREET, CITY, ST, ZIP").
  const recorded = {
    result: {
      input: {
        address: { address: "20 N Grand Blvd, St Louis, MO 63108" },
        benchmark: {
          isDefault: true,
          benchmarkDescription: "Public Address Ranges - Current Benchmark",
          id: "4",
          benchmarkName: "Public_AR_Current",
        },
      },
      addressMatches: [
        {
          tigerLine: { side: "R", tigerLineId: "107607932" },
          coordinates: { x: -90.2332, y: 38.63586 },
          addressComponents: {
            zip: "63103",
            streetName: "GRAND",
            preType: "",
            city: "SAINT LOUIS",
            preDirection: "N",
            suffixDirection: "",
            fromAddress: "2",
            state: "MO",
            suffixType: "BLVD",
            toAddress: "98",
            suffixQualifier: "",
            preQualifier: "",
          },
          matchedAddress: "20 N GRAND BLVD, SAINT LOUIS, MO, 63103",
        },
      ],
    },
  };

  it("x is the longitude and y the latitude", () => {
    expect(matchesFromCensus(censusResponseSchema.parse(recorded))).toEqual([
      {
        matchedAddress: "20 N GRAND BLVD, SAINT LOUIS, MO, 63103",
        latitude: 38.63586,
        longitude: -90.2332,
        state: "MO",
        zip: "63103",
      },
    ]);
  });

  it("no match is an empty list, not an error", () => {
    const none = { result: { ...recorded.result, addressMatches: [] } };
    expect(matchesFromCensus(censusResponseSchema.parse(none))).toEqual([]);
  });

  it("the one-line address joins street, town, state and ZIP", () => {
    expect(
      oneLineAddress({
        street: " 20 N Grand Blvd ",
        city: "St Louis",
        region: "MO",
        postalCode: "63108",
      }),
    ).toBe("20 N Grand Blvd, St Louis, MO 63108");
    expect(
      oneLineAddress({ street: "20 N Grand Blvd", city: "", region: "", postalCode: "63108" }),
    ).toBe("20 N Grand Blvd, 63108");
  });
});

describe("the client against the local fake", () => {
  let fake: Server;
  beforeAll(async () => {
    fake = await startFakeGeocoder(0);
  });
  afterAll(() => new Promise<void>((r) => fake.close(() => r())));

  it("finds each demo property at the scenario's coordinates, however the street type is written", async () => {
    const geocoder = censusGeocoder({ baseUrl: origin(fake) });
    for (const p of demoCompany.properties) {
      const [match, ...more] = await geocoder.findAddress(
        oneLineAddress({ ...p, street: p.street.replace(/Lane$/, "Ln") }),
      );
      expect(more).toEqual([]);
      expect(match).toMatchObject({
        latitude: p.latitude,
        longitude: p.longitude,
        state: p.region,
        zip: p.postalCode,
      });
      expect(match!.matchedAddress).toMatch(new RegExp(`, ${p.region}, ${p.postalCode}$`));
    }
  });

  it("an address it does not know, or with another ZIP, is no match", async () => {
    const geocoder = censusGeocoder({ baseUrl: origin(fake) });
    expect(await geocoder.findAddress("1 Nowhere Street, Larkfield, NJ 08561")).toEqual([]);
    expect(await geocoder.findAddress("14 Quillwort Lane, Larkfield, NJ 08999")).toEqual([]);
  });

  it("services() builds the client from GEOCODER_BASE_URL, and none without it", async () => {
    expect(createServices(parseServiceEnv({})).geocoder).toBeNull();
    const { geocoder } = createServices(parseServiceEnv({ GEOCODER_BASE_URL: origin(fake) }));
    expect(await geocoder!.findAddress("77 Bramblecote Road, Larkfield, NJ 08561")).toEqual([
      {
        matchedAddress: "77 BRAMBLECOTE RD, LARKFIELD, NJ, 08561",
        latitude: 40.3378,
        longitude: -74.7326,
        state: "NJ",
        zip: "08561",
      },
    ]);
  });

  it("the fake refuses a request the real service refuses (no address)", async () => {
    const res = await fetch(
      `${origin(fake)}/geocoder/locations/onelineaddress?address=&benchmark=Public_AR_Current&format=json`,
    );
    expect(res.status).toBe(400);
    expect(await res.json()).toMatchObject({ status: "400", errors: [expect.any(String)] });
  });
});

describe("a service that misbehaves", () => {
  let server: Server;
  let mode: "503" | "garbage" | "slow" | "400" = "503";
  beforeAll(async () => {
    server = createServer((_req, res) => {
      if (mode === "slow") return void setTimeout(() => res.end("{}"), 500);
      if (mode === "garbage") {
        res.writeHead(200, { "Content-Type": "application/json" });
        return void res.end(JSON.stringify({ result: { addressMatches: [{ x: 1 }] } }));
      }
      if (mode === "400") {
        res.writeHead(400, { "Content-Type": "application/json" });
        return void res.end(JSON.stringify({ errors: ["Invalid benchmark"], status: "400" }));
      }
      res.writeHead(503);
      res.end("down");
    });
    await new Promise<void>((r) => server.listen(0, "127.0.0.1", () => r()));
  });
  afterAll(() => new Promise<void>((r) => server.close(() => r())));

  const attempt = (timeoutMs = 2000) =>
    censusGeocoder({ baseUrl: origin(server), timeoutMs }).findAddress("1 Main St, Town, NJ 08561");

  it("each failure is a GeocoderUnavailable saying what happened", async () => {
    mode = "503";
    await expect(attempt()).rejects.toThrow(
      new GeocoderUnavailable("the address lookup service answered 503"),
    );
    mode = "400";
    await expect(attempt()).rejects.toThrow(
      "the address lookup service answered 400 (Invalid benchmark)",
    );
    mode = "garbage";
    await expect(attempt()).rejects.toThrow(
      "the address lookup service sent data Sward could not read",
    );
    mode = "slow";
    await expect(attempt(100)).rejects.toThrow("the address lookup service did not answer in time");
  });

  it("a service nobody answers at is 'could not be reached'", async () => {
    await expect(
      censusGeocoder({ baseUrl: "http://127.0.0.1:9" }).findAddress("1 Main St, Town, NJ"),
    ).rejects.toThrow("the address lookup service could not be reached");
  });
});
