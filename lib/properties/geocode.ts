// "Find the location from the address": the property form's address, looked up with the geocoder
// service (lib/services/geocoder). The matches are proposals the manager confirms on the form;
// nothing is saved here.
import "server-only";

import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/http/app-error";
import { log } from "@/lib/log";
import { services } from "@/lib/services";
import { GeocoderUnavailable } from "@/lib/services/geocoder/client";
import { oneLineAddress } from "@/lib/services/geocoder/contract";

import type { GeocodeResult } from "./dto";

/** At most this many matches are shown. */
const MAX_MATCHES = 5;

export async function geocodeAddress(
  actor: Actor,
  input: { street: string; city: string; region: string; postalCode: string },
): Promise<GeocodeResult> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can look up a property's address.");
  const address = oneLineAddress(input);
  const geocoder = services().geocoder;
  if (!geocoder)
    return {
      status: "unavailable",
      address,
      matches: [],
      message:
        "Address lookup is not set up on this server. Type the coordinates, or use this device's location.",
    };
  try {
    const matches = (await geocoder.findAddress(address)).slice(0, MAX_MATCHES);
    if (matches.length === 0)
      return {
        status: "no_match",
        address,
        matches: [],
        message: `No match for “${address}”. Check the street number, street and town, or type the coordinates.`,
      };
    return { status: "found", address, matches };
  } catch (err) {
    if (!(err instanceof GeocoderUnavailable)) throw err;
    log.warn({ event: "geocoder_unavailable", reason: err.message }, "address lookup failed");
    return {
      status: "unavailable",
      address,
      matches: [],
      message: `The address could not be looked up just now (${err.message}). Try again, type the coordinates, or use this device's location.`,
    };
  }
}
