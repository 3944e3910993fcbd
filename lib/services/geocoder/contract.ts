// The US Census Bureau geocoder's one-line-address endpoint as Sward reads it:
//   GET {GEOCODER_BASE_URL}/geocoder/locations/onelineaddress
//       ?address=…&benchmark=Public_AR_Current&format=json
//
// The answer's shape, and how it was confirmed:
// - Confirmed from published descriptions read for this work (the censusxy R package's reference
//   page for its one-line call, which prints a live answer's columns: coordinates.x, coordinates.y,
//   addressComponents.zip/streetName/city/preDirection…, tigerLine.side/tigerLineId; and
//   open-source clients' typed models of the answer: result.input.address.address,
//   result.input.benchmark {id, benchmarkName, benchmarkDescription, isDefault},
//   result.addressMatches[] {matchedAddress, coordinates {x, y}, tigerLine {side, tigerLineId},
//   addressComponents {fromAddress, toAddress, preQualifier, preDirection, preType, streetName,
//   suffixType, suffixDirection, suffixQualifier, city, state, zip}}): x is the longitude and y the
//   latitude, in decimal degrees; no match is an empty addressMatches list with status 200.
// - From memory, not read in the Bureau's own "Geocoding Services API" document: that a refused
//   request (a missing address, an unknown benchmark) answers 400 with `{ errors: [...],
//   status: "400" }`. Sward treats any non-2xx answer as "the service could not answer".
// Only the fields Sward uses are required; anything else the Bureau adds is ignored.
import { z } from "zod";

export const CENSUS_ONELINE_PATH = "/geocoder/locations/onelineaddress";
export const CENSUS_BENCHMARK = "Public_AR_Current";

const addressComponentsSchema = z
  .object({
    fromAddress: z.string().optional(),
    preDirection: z.string().optional(),
    preType: z.string().optional(),
    streetName: z.string().optional(),
    suffixType: z.string().optional(),
    suffixDirection: z.string().optional(),
    city: z.string().optional(),
    state: z.string().optional(),
    zip: z.string().optional(),
  })
  .loose();

const censusMatchSchema = z
  .object({
    matchedAddress: z.string(),
    coordinates: z.object({
      x: z.number().min(-180).max(180),
      y: z.number().min(-90).max(90),
    }),
    tigerLine: z.object({ side: z.string(), tigerLineId: z.string() }).loose().optional(),
    addressComponents: addressComponentsSchema.optional(),
  })
  .loose();

export const censusResponseSchema = z
  .object({
    result: z
      .object({
        input: z.unknown().optional(),
        addressMatches: z.array(censusMatchSchema),
      })
      .loose(),
  })
  .loose();

export const censusErrorSchema = z.object({ errors: z.array(z.string()) }).loose();

export type CensusResponse = z.infer<typeof censusResponseSchema>;
export type CensusMatch = z.infer<typeof censusMatchSchema>;

/** One match as Sward shows it to the manager. */
export interface AddressMatch {
  /** The address as the geocoder matched it, e.g. "14 QUILLWORT LN, LARKFIELD, NJ, 08561". */
  matchedAddress: string;
  latitude: number;
  longitude: number;
  /** The matched address's state code and ZIP, when the answer gives them. */
  state: string | null;
  zip: string | null;
}

/** The matches of an answer, coordinates rounded to 5 decimals (about 1 m, as the form keeps them). */
export function matchesFromCensus(body: CensusResponse): AddressMatch[] {
  return body.result.addressMatches.map((m) => ({
    matchedAddress: m.matchedAddress,
    latitude: Number(m.coordinates.y.toFixed(5)),
    longitude: Number(m.coordinates.x.toFixed(5)),
    state: m.addressComponents?.state || null,
    zip: m.addressComponents?.zip || null,
  }));
}

/** The one-line address sent: "street, city, ST ZIP". */
export function oneLineAddress(a: {
  street: string;
  city: string;
  region: string;
  postalCode: string;
}): string {
  return [a.street, a.city, `${a.region} ${a.postalCode}`.trim()]
    .map((s) => s.trim())
    .filter(Boolean)
    .join(", ");
}
