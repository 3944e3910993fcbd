// Links a stop opens on the technician's phone, and the route's figures in US units (pure).
//
// Directions: a Maps URL, https://www.google.com/maps/dir/?api=1&destination=LAT,LNG — the one
// form every phone opens: Android hands it to its maps app, iOS to the Google Maps app when
// installed and otherwise to the browser, and a desktop opens it in the browser. A `geo:` URI
// (RFC 5870) is the open standard but iOS Safari does not open it, so it would leave iPhone users
// with a dead button. Coordinates rather than the street address: the property's stored location
// is where the lawn is, and an address can be matched to the wrong side of a long road.
//
// Call: a `tel:` URI (RFC 3966) with the number in its global (E.164) form.
import { METERS_PER_MILE } from "@/lib/routing/great-circle";

export function directionsUrl(location: { latitude: number; longitude: number }): string {
  const destination = `${location.latitude.toFixed(6)},${location.longitude.toFixed(6)}`;
  return `https://www.google.com/maps/dir/?api=1&destination=${encodeURIComponent(destination)}&travelmode=driving`;
}

export function telHref(e164: string): string {
  return `tel:${e164}`;
}

/** "12.3 mi" (one decimal; "0.1 mi" at the least above zero). */
export function milesText(meters: number): string {
  const miles = meters / METERS_PER_MILE;
  if (miles > 0 && miles < 0.05) return "0.1 mi";
  return `${miles.toFixed(1)} mi`;
}

/** "7 min", "1 h 5 min" (whole minutes, rounded; "1 min" at the least above zero). */
export function drivingTimeText(seconds: number): string {
  const minutes = seconds > 0 ? Math.max(1, Math.round(seconds / 60)) : 0;
  if (minutes < 60) return `${minutes} min`;
  const rest = minutes % 60;
  return `${Math.floor(minutes / 60)} h${rest ? ` ${rest} min` : ""}`;
}
