// The routing client (lib/services/routing) against the local fake of OSRM's Table API
// (tests/harness/routing-fake.ts), against an answer in the engine's documented shape, and against
// a service that misbehaves: the day's route then falls back to the great-circle estimate and says
// why. Servers here listen on 127.0.0.1 only.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { estimatedMatrix, haversineMeters } from "@/lib/routing/great-circle";
import { osrmRouting, travelMatrix } from "@/lib/services/routing/client";
import {
  matrixFromTable,
  osrmTableSchema,
  tableRequestPath,
} from "@/lib/services/routing/contract";

import { startFakeRouting } from "../harness/routing-fake";

const origin = (s: Server) => `http://127.0.0.1:${(s.address() as AddressInfo).port}`;

// Three invented stops a few miles apart in central New Jersey.
const points = [
  { latitude: 40.3487, longitude: -74.6591 },
  { latitude: 40.3573, longitude: -74.6672 },
  { latitude: 40.3301, longitude: -74.6412 },
];

describe("the Table request and answer", () => {
  it("asks for longitude,latitude pairs with distances and durations", () => {
    expect(tableRequestPath(points.slice(0, 2))).toBe(
      "/table/v1/driving/-74.659100,40.348700;-74.667200,40.357300?annotations=distance,duration",
    );
  });

  it("reads an answer in the documented shape (code Ok, durations and distances row-major, waypoints)", () => {
    // The shape of docs/http.md's Table service: durations[i][j] seconds from i to j; with
    // annotations=distance,duration also distances[i][j] in meters; sources/destinations Waypoints.
    const answer = osrmTableSchema.parse({
      code: "Ok",
      durations: [
        [0, 300.5],
        [310.2, 0],
      ],
      distances: [
        [0, 2500.1],
        [2610.7, 0],
      ],
      sources: [
        { hint: "x", distance: 4.2, name: "Elm Road", location: [-74.6591, 40.3487] },
        { hint: "y", distance: 1.1, name: "", location: [-74.6672, 40.3573] },
      ],
      destinations: [],
    });
    expect(matrixFromTable(answer, points.slice(0, 2))).toEqual({
      matrix: {
        meters: [
          [0, 2500.1],
          [2610.7, 0],
        ],
        seconds: [
          [0, 300.5],
          [310.2, 0],
        ],
      },
      estimated: false,
    });
  });

  it("fills a pair the engine could not connect (null) with the estimate and marks it estimated", () => {
    const answer = osrmTableSchema.parse({
      code: "Ok",
      durations: [
        [0, null],
        [300, 0],
      ],
      distances: [
        [0, null],
        [2600, 0],
      ],
    });
    const result = matrixFromTable(answer, points.slice(0, 2))!;
    expect(result.estimated).toBe(true);
    expect(result.matrix.meters[0]![1]).toBeCloseTo(
      estimatedMatrix(points.slice(0, 2)).meters[0]![1]!,
      6,
    );
    expect(result.matrix.meters[1]![0]).toBe(2600);
  });

  it("refuses a table of the wrong size and an error answer", () => {
    const answer = osrmTableSchema.parse({ code: "Ok", durations: [[0]], distances: [[0]] });
    expect(matrixFromTable(answer, points.slice(0, 2))).toBeNull();
    expect(
      osrmTableSchema.safeParse({ code: "InvalidQuery", message: "Query string malformed" })
        .success,
    ).toBe(false);
  });
});

describe("against the local fake", () => {
  let fake: Server;
  beforeAll(async () => {
    fake = await startFakeRouting(0);
  });
  afterAll(() => new Promise<void>((resolve) => fake.close(() => resolve())));

  it("answers great-circle × 1.2 at 30 mph, in the engine's shape", async () => {
    const { matrix, estimated } = await osrmRouting({ baseUrl: origin(fake) }).table(points);
    expect(estimated).toBe(false);
    const crow = haversineMeters(points[0]!, points[1]!);
    expect(matrix.meters[0]![1]).toBeCloseTo(crow * 1.2, 0);
    // 30 mph = 13.4112 m/s.
    expect(matrix.seconds[0]![1]).toBeCloseTo((crow * 1.2) / 13.4112, 0);
    expect(matrix.meters[1]![1]).toBe(0);
  });

  it("refuses a malformed coordinate list with 400 InvalidQuery, as the engine does", async () => {
    const response = await fetch(`${origin(fake)}/table/v1/driving/abc;-74,40`);
    expect(response.status).toBe(400);
    expect(await response.json()).toMatchObject({ code: "InvalidQuery" });
  });

  it("travelMatrix uses the service's figures when it answers", async () => {
    const day = await travelMatrix(osrmRouting({ baseUrl: origin(fake) }), points);
    expect(day.estimated).toBe(false);
    expect(day.reason).toBeNull();
  });
});

describe("when the service misbehaves, the day's route is estimated and says why", () => {
  let broken: Server;
  let mode: "500" | "garbage" | "slow" = "500";
  beforeAll(async () => {
    broken = createServer((_req, res) => {
      if (mode === "500") {
        res.writeHead(500, { "Content-Type": "application/json" });
        res.end(JSON.stringify({ code: "InternalError", message: "boom" }));
      } else if (mode === "garbage") {
        res.writeHead(200, { "Content-Type": "text/html" });
        res.end("<html>proxy error</html>");
      } else setTimeout(() => res.end("{}"), 1000);
    });
    await new Promise<void>((resolve) => broken.listen(0, "127.0.0.1", resolve));
  });
  afterAll(() => new Promise<void>((resolve) => broken.close(() => resolve())));

  it("a 500 with an error code", async () => {
    mode = "500";
    const day = await travelMatrix(osrmRouting({ baseUrl: origin(broken) }), points);
    expect(day).toMatchObject({
      estimated: true,
      reason: "the routing service answered 500 (InternalError)",
    });
    expect(day.matrix).toEqual(estimatedMatrix(points));
  });

  it("an answer that is not the Table API's", async () => {
    mode = "garbage";
    const day = await travelMatrix(osrmRouting({ baseUrl: origin(broken) }), points);
    expect(day).toMatchObject({ estimated: true, reason: "the routing service answered 200" });
  });

  it("no answer in time", async () => {
    mode = "slow";
    const day = await travelMatrix(
      osrmRouting({ baseUrl: origin(broken), timeoutMs: 100 }),
      points,
    );
    expect(day).toMatchObject({
      estimated: true,
      reason: "the routing service did not answer in time",
    });
  });

  it("nothing listening", async () => {
    const day = await travelMatrix(osrmRouting({ baseUrl: "http://127.0.0.1:9" }), points);
    expect(day).toMatchObject({
      estimated: true,
      reason: "the routing service could not be reached",
    });
  });

  it("no service configured", async () => {
    const day = await travelMatrix(null, points);
    expect(day).toMatchObject({ estimated: true, reason: "no routing service is set up" });
  });
});
