// The service clients are built from the validated configuration (lib/env.ts) in one place
// (lib/services): what each setting turns on, and that the "quick" weather client gives up after
// one try while the background one retries. Servers here listen on 127.0.0.1 only.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { parseServiceEnv } from "@/lib/env";
import { createServices } from "@/lib/services";

describe("parseServiceEnv", () => {
  it("needs no database or sign-in secret (the worker and the scripts carry none)", () => {
    expect(parseServiceEnv({})).toMatchObject({
      PHOTO_STORAGE: "local",
      PHOTO_DIR: ".data/photos",
    });
  });

  it("names what is wrong", () => {
    expect(() => parseServiceEnv({ SMTP_URL: "http://mail" })).toThrow(
      /Invalid service configuration:[\s\S]*SMTP_URL must be an smtp/,
    );
    expect(() => parseServiceEnv({ PHOTO_STORAGE: "s3" })).toThrow(
      /S3_BUCKET is required when PHOTO_STORAGE=s3/,
    );
  });
});

describe("createServices", () => {
  it("without SMTP_URL or WEATHER_BASE_URL there is no mailer and no weather client", () => {
    const s = createServices(parseServiceEnv({}));
    expect(s.mailer).toBeNull();
    expect(s.weather).toBeNull();
    expect(s.quickWeather).toBeNull();
  });

  it("PHOTO_STORAGE=local stores under PHOTO_DIR", async () => {
    const dir = mkdtempSync(path.join(tmpdir(), "sward-services-"));
    try {
      const { photoStorage } = createServices(parseServiceEnv({ PHOTO_DIR: dir }));
      await photoStorage.put("c1/display/ab.webp", Buffer.from("bytes"), "image/webp");
      expect(readFileSync(path.join(dir, "c1/display/ab.webp"), "utf8")).toBe("bytes");
      expect(await photoStorage.get("c1/display/ab.webp")).toEqual(Buffer.from("bytes"));
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it("SMTP_URL gives a mailer", () => {
    expect(
      createServices(parseServiceEnv({ SMTP_URL: "smtp://127.0.0.1:2525" })).mailer,
    ).not.toBeNull();
  });

  describe("WEATHER_BASE_URL against a service that answers 503", () => {
    let server: Server;
    const seen: { path: string; apikey: string | null }[] = [];
    let base = "";
    beforeAll(async () => {
      server = createServer((req, res) => {
        const url = new URL(req.url ?? "/", "http://127.0.0.1");
        seen.push({ path: url.pathname, apikey: url.searchParams.get("apikey") });
        res.writeHead(503).end();
      });
      await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
      base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    });
    afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

    it("the quick client tries once; the background client three times; both send the key as Open-Meteo's `apikey`", async () => {
      const s = createServices(
        parseServiceEnv({ WEATHER_BASE_URL: base, WEATHER_API_KEY: "k-123" }),
      );
      const today = new Date().toISOString().slice(0, 10);
      seen.length = 0;
      await expect(s.quickWeather!.daily(40, -74, today, today)).rejects.toThrow(/answered 503/);
      expect(seen).toEqual([{ path: "/v1/forecast", apikey: "k-123" }]);
      seen.length = 0;
      await expect(s.weather!.daily(40, -74, today, today)).rejects.toThrow(/answered 503/);
      expect(seen.length).toBe(3);
    });

    it("asks the archive (WEATHER_ARCHIVE_URL) for days older than the forecast endpoint keeps", async () => {
      const s = createServices(
        parseServiceEnv({ WEATHER_BASE_URL: "http://127.0.0.1:9", WEATHER_ARCHIVE_URL: base }),
      );
      seen.length = 0;
      await expect(s.quickWeather!.daily(40, -74, "2024-06-01", "2024-06-02")).rejects.toThrow(
        /answered 503/,
      );
      expect(seen).toEqual([{ path: "/v1/archive", apikey: null }]);
    });
  });
});
