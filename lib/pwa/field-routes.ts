// Which requests the service worker (app/sw.ts) may answer from the device's caches when the
// network is gone (pure; shared by the worker, the warm-up on Today and their tests).
//
// Only the technician's field screens and the data those screens read are kept: Today, a visit,
// and the visit's own requests. Sign-in, office pages, every other API and every write are never
// cached (a shared phone must not show one person's office data to the next).

const UUID = "[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}";

/** Pages a technician opens in the field: Today (any day) and one visit (any zone of it). */
const FIELD_PAGE = new RegExp(`^/(?:today|visits/${UUID})/?$`, "i");

/** The reads behind those pages (components/visits, components/applications). */
const FIELD_DATA = [
  /^\/api\/v1\/today$/,
  new RegExp(`^/api/v1/visits/${UUID}$`, "i"),
  /^\/api\/v1\/products$/,
  /^\/api\/v1\/rule-sets$/,
  /^\/api\/v1\/me\/applicator$/,
  new RegExp(`^/api/v1/photos/${UUID}/thumb$`, "i"),
];

export function isFieldPage(pathname: string): boolean {
  return FIELD_PAGE.test(pathname);
}

/** A visit page: its zones are ?zone=… on the same page, so one stored copy serves them all. */
export function isVisitPage(pathname: string): boolean {
  return isFieldPage(pathname) && pathname.startsWith("/visits/");
}

export function isFieldData(pathname: string): boolean {
  return FIELD_DATA.some((r) => r.test(pathname));
}

/** Pages the worker never touches, even to show the offline page (signing in needs the network). */
export function isSignInPath(pathname: string): boolean {
  return /^\/(?:sign-in|invitation|api\/)/.test(pathname);
}

/** The names of the caches that hold a person's field data (cleared at sign-out). */
export const FIELD_CACHES = {
  pages: "sward-field-pages",
  rsc: "sward-field-rsc",
  data: "sward-field-data",
} as const;

/** The tag the outbox registers for Background Sync; the worker asks the page to replay. */
export const OUTBOX_SYNC_TAG = "sward-outbox";

/** Messages between the pages and the worker. */
export const SW_MESSAGES = {
  /** Worker → pages: replay the outbox now (a Background Sync event fired). */
  replay: "sward:replay",
  /** Page → worker: forget every cached field response (sign-out, another person signed in). */
  clear: "sward:clear",
} as const;
