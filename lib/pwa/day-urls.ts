// The addresses a day of stops needs offline (pure): the same requests the field screens make
// (components/visits, components/applications), fetched ahead on Today so the service worker
// keeps them (lib/pwa/field-routes.ts says which it keeps).

/** The part of a stop and of a visit's detail the list needs (TodayStopDto, VisitDetailDto). */
export interface StopRef {
  id: string;
}
export interface VisitRef {
  id: string;
  photos: { thumbUrl: string }[];
  lastChecks: { photo: { thumbUrl: string } | null }[];
}

/** Today's page and list for a day (`/today` for the current day, as the menu links it). */
export function dayUrls(date: string, today: string): string[] {
  return [date === today ? "/today" : `/today?date=${date}`, `/api/v1/today?date=${date}`];
}

/** What every visit screen reads, whatever the stop: products, rule sets, the applicator. */
export const SHARED_URLS = ["/api/v1/products", "/api/v1/rule-sets", "/api/v1/me/applicator"];

/** A stop's visit page and its detail (zones, checks, each zone's last check). */
export function stopUrls(stop: StopRef): string[] {
  return [`/visits/${stop.id}`, `/api/v1/visits/${stop.id}`];
}

/** What a visit's detail points to: the photo thumbnails (this visit's, each zone's last
 * check's). Only what a technician may read: a finished visit's audit trail is the managers'
 * (GET /api/v1/visits/:id/audit answers a technician 403), so it is not fetched ahead; asking for
 * it made every day with a finished stop "saved with gaps". */
export function visitUrls(visit: VisitRef): string[] {
  return [
    ...new Set([
      ...visit.photos.map((p) => p.thumbUrl),
      ...visit.lastChecks.flatMap((c) => (c.photo ? [c.photo.thumbUrl] : [])),
    ]),
  ];
}
