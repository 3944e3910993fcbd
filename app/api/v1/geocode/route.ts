// GET /api/v1/geocode?street=&city=&region=&postalCode= — the address's location from the geocoder
// service (manager): { status: "found" | "no_match" | "unavailable", address, matches, message? }.
// Proposals only: the manager confirms a match on the property form; nothing is saved.
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { geocodeAddress } from "@/lib/properties/geocode";

const part = (label: string, max: number) =>
  z.string().trim().max(max, `${label}: at most ${max} characters.`).default("");

const query = z
  .object({
    street: z
      .string(`Street address is required to look up the location.`)
      .trim()
      .min(1, "Street address is required to look up the location.")
      .max(200, "Street address: at most 200 characters."),
    city: part("Town or city", 100),
    region: part("State", 100),
    postalCode: part("ZIP code", 10),
  })
  .strict()
  .refine((q) => q.city !== "" || q.postalCode !== "", {
    message: "Town or city, or ZIP code, is needed to look up the location.",
    path: ["city"],
  });

export const GET = route({ access: ["manager"], query }, async ({ actor, query }) =>
  geocodeAddress(actor, query),
);
