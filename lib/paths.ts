// The paths of the pages that links, redirects and e-mails point at, named with the glossary's
// words. Old paths keep answering through redirects (next.config.ts and the /properties page).

/** The manager's book: every property the company serves. */
export const BOOK_PATH = "/book";

/** The book on a map (the same filters as the book). */
export const BOOK_MAP_PATH = "/book/map";

/** MapLibre GL's worker script, served from this origin. */
export const BOOK_MAP_WORKER_PATH = "/book/map/worker";

/** Risk alerts across the viewer's reach. */
export const RISK_ALERTS_PATH = "/risk-alerts";

/** The homeowner's visit report of one finished visit (e-mails link here). */
export function visitReportPath(visitId: string): string {
  return `/my-lawn/reports/${visitId}`;
}
