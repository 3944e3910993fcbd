// The authorisation matrix (OWASP ASVS 5.0 V8, access control and tenant isolation; Next.js's
// data-security guidance: every route handler, page and server action is a public endpoint).
// Every route handler, page and server action of the app × seven people × the expected outcome,
// walked over HTTP against the production server. Denied cells are tried again with a forged
// `x-middleware-subrequest` header and as RSC / prefetch requests (`?_rsc=`, `RSC: 1`,
// `Next-Router-Prefetch: 1`, `.rsc`). A route, page or action that is not in the table fails the
// suite, so a new endpoint cannot ship without saying who may use it.
//
// Outcomes: "allow" — the request gets past authorisation (not 401/403/404, never 5xx) and, where
// a marker is named, shows it; "deny" — 401/403/404 for APIs, a redirect or 404 for pages, and no
// trace of the property; "hidden" — a list answered with the person's own data and no trace of it.
import { randomUUID } from "node:crypto";
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { beforeAll, describe, expect, inject, it } from "vitest";

import { mintSessionCookie, useE2eDatabase } from "../helpers/e2e-db";
import { doneCheck } from "../helpers/zone-checks";

const BASE = inject("baseUrl");
const PERSONAS = [
  "anonymous",
  "owner",
  "otherOwner",
  "assignedTech",
  "otherTech",
  "manager",
  "otherManager",
] as const;
type Persona = (typeof PERSONAS)[number];
const SIGNED_IN: Persona[] = PERSONAS.filter((p) => p !== "anonymous");

/** The records the matrix points at: one property of the company (tech1's, owner1's) and what hangs off it. */
interface Targets {
  propertyId: string;
  propertyName: string;
  street: string;
  zoneId: string;
  visitId: string; // scheduled at the property for tech1; started, checked and finished by the matrix
  cancelVisitId: string; // another scheduled visit, for cancel (rained out) and reschedule
  rescheduleOn: string; // a free day for the rained-out stop
  moveVisitId: string; // a stop weeks ahead, moved on the week's schedule
  moveTo: string;
  rainDay: string; // a day weeks ahead with one stop of tech1, rained out on the schedule
  tech1Id: string;
  completedVisitId: string;
  alertId: string;
  productId: string;
  productName: string;
  ruleSetId: string;
  ruleSetName: string;
  programId: string; // a season program of the company (the property follows it)
  programName: string;
  zoneName: string;
  extraOwnerId: string; // a homeowner linked only for the unlink cell
  invitationId: string; // a pending invitation to the property, for the resend cell
  invitationEmail: string;
  revokeInvitationId: string; // another, for the withdraw cell
  staffInvitationId: string; // a pending staff invitation, for the resend cell
  staffRevokeInvitationId: string; // another, for the withdraw cell
  spareTechId: string; // a technician of the company made for the People cells (role, license, reassign)
  assignedTechId: string; // tech1
  zoneCheckId: string;
  photoId: string;
  ownerEmail: string;
  propertyBody: Record<string, unknown>;
  zoneBody: Record<string, unknown>;
  today: string;
}

interface Cell {
  key: string; // "GET /api/v1/…[param]" as the file system names it, "PAGE /…" or "ACTION file#name"
  case?: string;
  path: (t: Targets) => string;
  method?: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  body?: (t: Targets) => unknown;
  bytes?: () => Promise<Buffer>;
  allow: readonly Persona[];
  hidden?: readonly Persona[];
  /** Shown to those allowed (default: nothing checked beyond the status). */
  marker?: (t: Targets) => string;
  /** Must not appear for those denied or hidden (default: the property's name, street and id). */
  leak?: (t: Targets) => string[];
  after?: (t: Targets, persona: Persona, body: string) => void;
  /** Runs before the cell (e.g. the visit's other zones checked, so finishing can succeed). */
  before?: (t: Targets) => Promise<void>;
  /** At least one allowed person must get a 2xx (the write really happened). */
  mustSucceed?: boolean;
  /** Also a refusal for this cell: e.g. 422 "choose a property of your book" for another company's id in the body. */
  refusedAs?: number[];
  /** Public: every answer but a 5xx (redirects to where a signed-in person belongs included). */
  isPublic?: boolean;
}

const ownerSide: Persona[] = ["owner", "assignedTech", "manager"];
let checkEveryZone: (t: Targets) => Promise<void>; // set up in beforeAll
/** A new program of the company no property follows, for the delete cell (set up in beforeAll). */
let makeProgram: () => Promise<string>;
/** tech1's stops of today, read just before the cell that reorders them (set up in beforeAll). */
let readTech1Day: (t: Targets) => Promise<void>;
let tech1Day: string[] = [];
/** An entry of the visit (or, for waterings, the homeowner's own) made for a correct/delete cell; set up in beforeAll. */
let makeEntry: (
  kind: "application" | "photo" | "zoneCheck" | "watering" | "soilTest",
  t: Targets,
) => Promise<string>;
/** Entries waiting for a correct/delete cell: each allowed person who succeeds uses up the first. */
const queued: Record<string, string[]> = {};
const nextOf = (key: string) => queued[key]?.[0] ?? randomUUID();
const usedOne = (key: string) => () => {
  queued[key]?.shift();
};
const queue =
  (key: string, kind: Parameters<typeof makeEntry>[0], count: number) => async (t: Targets) => {
    queued[key] = [];
    for (let i = 0; i < count; i++) queued[key].push(await makeEntry(kind, t));
  };
/** A soil test of the whole property, its lab named uniquely (one sample per lab, date and zone). */
const soilTestBody = (t: Targets) => ({
  zoneId: null,
  sampledOn: t.today,
  lab: `Matrix lab ${randomUUID()}`,
  sampleDepthIn: 4,
  extractant: "mehlich3",
  ph: 6.1,
  bufferPh: null,
  bufferMethod: null,
  organicMatterPct: null,
  pPpm: 18,
  kPpm: null,
  caPpm: null,
  mgPpm: null,
  sPpm: null,
  labLimeLbPer1000: null,
  labPhosphorusNeeded: null,
  notes: "",
});
const applicationBody = (t: Targets) => ({
  zoneId: t.zoneId,
  productId: t.productId,
  rateAmount: 1,
  rateUnit: "lb/1000ft2",
  windMph: null,
  temperatureF: null,
  isEstablishing: false,
  applicatorName: "",
  applicatorLicence: "",
  overrideReason: null,
});
const CELLS: Cell[] = [
  // Public endpoints.
  { key: "PAGE /", path: () => "/", allow: PERSONAS, isPublic: true },
  { key: "PAGE /sign-in", path: () => "/sign-in", allow: PERSONAS, isPublic: true },
  { key: "PAGE /sign-in/link", path: () => "/sign-in/link", allow: PERSONAS, isPublic: true },
  {
    key: "PAGE /offline",
    case: "the service worker's page for no signal: it says nothing about anyone",
    path: () => "/offline",
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "PAGE /invitation",
    case: "an invitation link: what it shows is for whoever holds the token",
    path: () => `/invitation?token=${"0".repeat(64)}`,
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "GET /api/auth/[...nextauth]",
    path: () => "/api/auth/csrf",
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "POST /api/auth/[...nextauth]",
    case: "Auth.js's own sign-in-link endpoint is closed",
    path: () => "/api/auth/signin/nodemailer",
    method: "POST",
    body: () => ({ email: "owner1@demo.sward.test" }),
    allow: [],
  },

  // Pages.
  {
    key: "PAGE /my-lawn",
    path: () => "/my-lawn",
    allow: ["owner"],
    hidden: ["otherOwner"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /my-lawn/reports/[visitId]",
    path: (t) => `/my-lawn/reports/${t.completedVisitId}`,
    allow: ["owner"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /risk-alerts",
    path: () => "/risk-alerts",
    allow: ["assignedTech", "manager"],
    hidden: ["otherTech", "otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /dev/mail",
    path: () => "/dev/mail",
    allow: ["manager", "otherManager"],
    marker: () => "Development inbox",
  },
  {
    key: "PAGE /products",
    path: () => "/products",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.productName,
    leak: (t) => [t.productId],
  },
  {
    key: "PAGE /properties/[propertyId]/edit",
    path: (t) => `/properties/${t.propertyId}/edit`,
    allow: ["manager"],
    marker: (t) => t.street,
  },
  {
    key: "PAGE /properties/[propertyId]",
    path: (t) => `/properties/${t.propertyId}`,
    allow: ["assignedTech", "manager"],
    marker: (t) => t.street,
  },
  {
    key: "PAGE /properties/[propertyId]/zones/[zoneId]",
    path: (t) => `/properties/${t.propertyId}/zones/${t.zoneId}`,
    allow: ["assignedTech", "manager"],
    marker: (t) => t.zoneName,
  },
  {
    key: "PAGE /properties/new",
    path: () => "/properties/new",
    allow: ["manager", "otherManager"],
    marker: () => "New property",
  },
  {
    key: "PAGE /book",
    path: () => "/book",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /book/map",
    path: () => "/book/map",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /properties",
    case: "the technician's properties; managers are sent to the book",
    path: () => "/properties",
    allow: ["assignedTech"],
    hidden: ["otherTech"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /records",
    path: () => "/records",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: () => "Application records",
  },
  {
    key: "PAGE /programs",
    path: () => "/programs",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.programName,
    leak: (t) => [t.programId],
  },
  {
    key: "PAGE /rule-sets",
    path: () => "/rule-sets",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.ruleSetName,
    leak: (t) => [t.ruleSetId],
  },
  {
    key: "PAGE /people",
    path: () => "/people",
    // Each manager sees their own company's people; nothing of the other company's.
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.ownerEmail,
    leak: (t) => [t.ownerEmail, t.propertyName],
  },
  {
    key: "PAGE /settings",
    path: () => "/settings",
    // Each manager sees their own company's settings (locale, time zone); nothing of a property.
    allow: ["manager", "otherManager"],
    marker: () => "Language and region",
  },
  {
    key: "GET /api/v1/company-settings",
    path: () => "/api/v1/company-settings",
    allow: ["manager", "otherManager"],
    marker: () => "en-US",
  },
  {
    key: "PUT /api/v1/company-settings",
    path: () => "/api/v1/company-settings",
    method: "PUT",
    body: () => ({ locale: "en-US", timeZone: "America/New_York" }),
    allow: ["manager", "otherManager"],
    mustSucceed: true,
  },
  {
    key: "GET /api/v1/company-settings/pressure-areas",
    path: () => "/api/v1/company-settings/pressure-areas",
    allow: ["manager", "otherManager"],
    marker: () => "minProperties",
  },
  {
    key: "PUT /api/v1/company-settings/pressure-areas",
    path: () => "/api/v1/company-settings/pressure-areas",
    method: "PUT",
    body: () => ({ distanceMi: 1, days: 7, minProperties: 3 }),
    allow: ["manager", "otherManager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/company-settings/yard",
    path: () => "/api/v1/company-settings/yard",
    method: "PUT",
    body: () => ({ address: "61 Tanager Road, Larkfield", latitude: 40.305, longitude: -74.73 }),
    allow: ["manager", "otherManager"],
    mustSucceed: true,
  },
  {
    key: "PAGE /today",
    path: () => "/today",
    allow: ["assignedTech"],
    hidden: ["otherTech"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /visits/[visitId]",
    path: (t) => `/visits/${t.visitId}`,
    allow: ["assignedTech", "manager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /visits",
    path: () => "/visits",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "PAGE /schedule",
    path: () => "/schedule",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },

  // Reads.
  { key: "GET /api/v1/me", path: () => "/api/v1/me", allow: SIGNED_IN, leak: () => [] },
  {
    key: "GET /api/v1/schedule",
    case: "this week: the property's stops of today",
    path: () => "/api/v1/schedule",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "GET /api/v1/me/applicator",
    path: () => "/api/v1/me/applicator",
    allow: ["assignedTech", "otherTech", "manager", "otherManager"],
    leak: () => [],
  },
  {
    key: "GET /api/v1/people",
    path: () => "/api/v1/people",
    // Technicians list only the homeowners of their own properties (lib/people/queries.ts).
    allow: ["assignedTech", "manager"],
    hidden: ["otherTech", "otherManager"],
    marker: (t) => t.ownerEmail,
    leak: (t) => [t.ownerEmail],
  },
  {
    key: "GET /api/v1/properties",
    path: () => "/api/v1/properties",
    allow: ownerSide,
    hidden: ["otherOwner", "otherTech", "otherManager"],
    marker: (t) => t.propertyId,
  },
  {
    key: "GET /api/v1/properties/[propertyId]",
    path: (t) => `/api/v1/properties/${t.propertyId}`,
    allow: ownerSide,
    marker: (t) => t.street,
  },
  {
    key: "GET /api/v1/properties/[propertyId]/waterings",
    path: (t) => `/api/v1/properties/${t.propertyId}/waterings`,
    allow: ownerSide,
  },
  {
    key: "GET /api/v1/properties/[propertyId]/soil-tests",
    path: (t) => `/api/v1/properties/${t.propertyId}/soil-tests`,
    allow: ["assignedTech", "manager"],
  },
  {
    key: "GET /api/v1/zones/[zoneId]/checks",
    path: (t) => `/api/v1/zones/${t.zoneId}/checks`,
    allow: ["assignedTech", "manager"],
  },
  {
    key: "GET /api/v1/zones/[zoneId]/photos",
    path: (t) => `/api/v1/zones/${t.zoneId}/photos`,
    allow: ownerSide,
  },
  {
    key: "GET /api/v1/visits",
    path: () => "/api/v1/visits",
    allow: ["assignedTech", "manager"],
    hidden: ["otherTech", "otherManager"],
    marker: (t) => t.visitId,
  },
  {
    key: "GET /api/v1/visits/[visitId]",
    path: (t) => `/api/v1/visits/${t.visitId}`,
    allow: ["assignedTech", "manager"],
    marker: (t) => t.visitId,
  },
  {
    key: "GET /api/v1/visits/[visitId]/audit",
    path: (t) => `/api/v1/visits/${t.visitId}/audit`,
    allow: ["manager"],
  },
  {
    key: "GET /api/v1/today",
    path: () => "/api/v1/today",
    allow: ["assignedTech", "manager"],
    hidden: ["otherTech", "otherManager"],
    marker: (t) => t.propertyId,
  },
  {
    key: "GET /api/v1/today/route",
    case: "tech1's day: their own, or a manager naming them (another company's manager: 422)",
    path: (t) => `/api/v1/today/route?date=${t.today}&technicianId=${t.tech1Id}`,
    allow: ["assignedTech", "manager"],
    refusedAs: [422],
    marker: (t) => t.propertyName,
  },
  {
    key: "POST /api/v1/today/route",
    case: "tech1's day put in driving order",
    path: () => "/api/v1/today/route",
    method: "POST",
    body: (t) => ({ date: t.today, technicianId: t.tech1Id }),
    allow: ["assignedTech", "manager"],
    refusedAs: [422],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/today/order",
    case: "tech1's day in reverse order, set by hand",
    path: () => "/api/v1/today/order",
    method: "PUT",
    before: (t) => readTech1Day(t),
    body: (t) => ({ date: t.today, technicianId: t.tech1Id, visitIds: tech1Day }),
    allow: ["assignedTech", "manager"],
    refusedAs: [422],
    mustSucceed: true,
  },
  {
    key: "GET /api/v1/alerts",
    path: () => "/api/v1/alerts",
    allow: ["assignedTech", "manager"],
    hidden: ["otherTech", "otherManager"],
    marker: (t) => t.alertId,
    leak: (t) => [t.alertId, t.propertyId],
  },
  {
    key: "GET /api/v1/book",
    path: () => "/api/v1/book",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyId,
  },
  {
    key: "GET /book/map/worker",
    case: "MapLibre GL's worker script for the map page",
    path: () => "/book/map/worker",
    allow: ["manager", "otherManager"],
    marker: () => "MapLibre",
  },
  {
    key: "GET /api/v1/book/map",
    path: () => "/api/v1/book/map",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyId,
  },
  {
    key: "GET /api/v1/book/export",
    path: () => "/api/v1/book/export",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "GET /api/v1/records/applications",
    path: (t) => `/api/v1/records/applications?from=${t.today.slice(0, 4)}-01-01&to=${t.today}`,
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.propertyName,
  },
  {
    key: "GET /api/v1/products",
    path: () => "/api/v1/products",
    allow: ["assignedTech", "otherTech", "manager"],
    hidden: ["otherManager"],
    marker: (t) => t.productId,
    leak: (t) => [t.productId],
  },
  {
    key: "GET /api/v1/geocode",
    case: "an address's location from the geocoder (the local fake): managers of any company, no book data",
    path: () =>
      `/api/v1/geocode?${new URLSearchParams({ street: "77 Bramblecote Road", city: "Larkfield", region: "NJ", postalCode: "08561" })}`,
    allow: ["manager", "otherManager"],
    marker: () => "BRAMBLECOTE RD, LARKFIELD, NJ, 08561",
  },
  {
    key: "GET /api/v1/geocode",
    case: "the targeted property's own address: the match reaches managers only",
    path: (t) =>
      `/api/v1/geocode?${new URLSearchParams({ street: t.street, city: "Larkfield", region: "NJ" })}`,
    allow: ["manager", "otherManager"],
    marker: () => "40.3342",
    leak: () => ["40.3342", "QUILLWORT"],
  },
  {
    key: "GET /api/v1/rule-sets",
    path: () => "/api/v1/rule-sets",
    allow: ["assignedTech", "otherTech", "manager"],
    hidden: ["otherManager"],
    marker: (t) => t.ruleSetId,
    leak: (t) => [t.ruleSetId],
  },
  {
    key: "GET /api/v1/programs",
    path: () => "/api/v1/programs",
    allow: ["manager"],
    hidden: ["otherManager"],
    marker: (t) => t.programId,
    leak: (t) => [t.programId],
  },
  {
    key: "GET /api/v1/programs/[programId]",
    path: (t) => `/api/v1/programs/${t.programId}`,
    allow: ["manager"],
    marker: (t) => t.programName,
    leak: (t) => [t.programId, t.programName],
  },
  {
    key: "GET /api/v1/properties/[propertyId]/program",
    path: (t) => `/api/v1/properties/${t.propertyId}/program`,
    allow: ["assignedTech", "manager"],
    marker: (t) => t.programId,
  },

  // Writes on the company's records (valid bodies: what a denied person sends would have worked for someone allowed).
  {
    key: "POST /api/v1/products",
    path: () => "/api/v1/products",
    method: "POST",
    body: () => ({
      name: `Matrix blend ${randomUUID().slice(0, 6)}`,
      form: "granular",
      nPct: 20,
      p2o5Pct: 0,
      k2oPct: 5,
      slowReleasePctOfN: 0,
      densityLbPerGal: null,
      isPesticide: false,
      registrationNumber: "",
      labelCautions: "",
      reentryGuidance: "",
    }),
    allow: ["manager", "otherManager"],
    leak: () => [],
  },
  {
    key: "PUT /api/v1/products/[productId]",
    path: (t) => `/api/v1/products/${t.productId}`,
    method: "PUT",
    body: () => ({
      name: "Matrix feed 24-0-6",
      form: "granular",
      nPct: 24,
      p2o5Pct: 0,
      k2oPct: 6,
      slowReleasePctOfN: 30,
      densityLbPerGal: null,
      isPesticide: false,
      registrationNumber: "",
      labelCautions: "",
      reentryGuidance: "",
    }),
    allow: ["manager"],
    leak: (t) => [t.productId],
  },
  {
    key: "POST /api/v1/products/[productId]/archive",
    path: (t) => `/api/v1/products/${t.productId}/archive`,
    method: "POST",
    body: () => ({ archived: false }),
    allow: ["manager"],
    leak: (t) => [t.productId],
  },
  {
    key: "POST /api/v1/rule-sets",
    path: () => "/api/v1/rule-sets",
    method: "POST",
    body: () => ruleSetBody(`Matrix rules ${randomUUID().slice(0, 6)}`),
    allow: ["manager", "otherManager"],
    leak: () => [],
  },
  {
    key: "POST /api/v1/programs",
    path: () => "/api/v1/programs",
    method: "POST",
    body: () => programBody(randomUUID()),
    allow: ["manager", "otherManager"],
    leak: () => [],
  },
  {
    key: "PUT /api/v1/programs/[programId]",
    path: (t) => `/api/v1/programs/${t.programId}`,
    method: "PUT",
    body: (t) => programBody(t.programId, t.programName),
    allow: ["manager"],
    leak: (t) => [t.programId],
    mustSucceed: true,
  },
  {
    key: "DELETE /api/v1/programs/[programId]",
    path: () => `/api/v1/programs/${nextOf("deleteProgram")}`,
    method: "DELETE",
    before: async () => {
      queued["deleteProgram"] = [await makeProgram()];
    },
    body: () => ({}),
    allow: ["manager"],
    mustSucceed: true,
    after: usedOne("deleteProgram"),
  },
  {
    key: "PUT /api/v1/properties/[propertyId]/program",
    path: (t) => `/api/v1/properties/${t.propertyId}/program`,
    method: "PUT",
    body: (t) => ({ programId: t.programId }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/zones/[zoneId]/program",
    path: (t) => `/api/v1/zones/${t.zoneId}/program`,
    method: "PUT",
    body: () => ({ method: "granular", excludedYear: null, excludedReason: null }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/rule-sets/[ruleSetId]",
    path: (t) => `/api/v1/rule-sets/${t.ruleSetId}`,
    method: "PUT",
    body: () => ruleSetBody("Matrix rules (edited)"),
    allow: ["manager"],
    leak: (t) => [t.ruleSetId],
  },
  {
    key: "POST /api/v1/properties",
    path: () => "/api/v1/properties",
    method: "POST",
    body: (t) => ({
      ...t.propertyBody,
      name: `Matrix lot ${randomUUID().slice(0, 6)}`,
      street: "2 Matrix Row",
      technicianId: null,
      ruleSetId: null,
    }),
    allow: ["manager", "otherManager"],
    leak: () => [],
  },
  {
    key: "PUT /api/v1/properties/[propertyId]",
    path: (t) => `/api/v1/properties/${t.propertyId}`,
    method: "PUT",
    body: (t) => t.propertyBody,
    allow: ["manager"],
  },
  {
    key: "POST /api/v1/properties/[propertyId]/archive",
    path: (t) => `/api/v1/properties/${t.propertyId}/archive`,
    method: "POST",
    body: () => ({ archived: false }),
    allow: ["manager"],
  },
  {
    key: "POST /api/v1/properties/[propertyId]/zones",
    path: (t) => `/api/v1/properties/${t.propertyId}/zones`,
    method: "POST",
    body: (t) => ({ ...t.zoneBody, name: `Matrix strip ${randomUUID().slice(0, 4)}` }),
    allow: ["manager"],
  },
  {
    key: "PUT /api/v1/zones/[zoneId]",
    path: (t) => `/api/v1/zones/${t.zoneId}`,
    method: "PUT",
    body: (t) => t.zoneBody,
    allow: ["manager"],
  },
  {
    key: "POST /api/v1/zones/[zoneId]/archive",
    path: (t) => `/api/v1/zones/${t.zoneId}/archive`,
    method: "POST",
    body: () => ({ archived: false }),
    allow: ["manager"],
  },
  {
    key: "GET /api/v1/properties/[propertyId]/invitations",
    path: (t) => `/api/v1/properties/${t.propertyId}/invitations`,
    allow: ["manager"],
    marker: (t) => t.invitationEmail,
    leak: (t) => [t.invitationEmail, t.propertyId],
  },
  {
    key: "POST /api/v1/properties/[propertyId]/invitations",
    path: (t) => `/api/v1/properties/${t.propertyId}/invitations`,
    method: "POST",
    body: () => ({
      email: `matrix-${randomUUID().slice(0, 8)}@test.sward.test`,
      name: "Matrix Neighbour",
    }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/properties/[propertyId]/invitations/[invitationId]/resend",
    path: (t) => `/api/v1/properties/${t.propertyId}/invitations/${t.invitationId}/resend`,
    method: "POST",
    allow: ["manager"],
    mustSucceed: true,
    leak: (t) => [t.invitationEmail, t.propertyId],
  },
  {
    key: "DELETE /api/v1/properties/[propertyId]/invitations/[invitationId]",
    path: (t) => `/api/v1/properties/${t.propertyId}/invitations/${t.revokeInvitationId}`,
    method: "DELETE",
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/people/invitations",
    path: () => "/api/v1/people/invitations",
    method: "POST",
    body: () => ({
      email: `matrix-staff-${randomUUID().slice(0, 8)}@test.sward.test`,
      name: "Matrix Staff",
      role: "technician",
    }),
    // Each manager invites into their own company.
    allow: ["manager", "otherManager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/people/invitations/[invitationId]/resend",
    path: (t) => `/api/v1/people/invitations/${t.staffInvitationId}/resend`,
    method: "POST",
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "DELETE /api/v1/people/invitations/[invitationId]",
    path: (t) => `/api/v1/people/invitations/${t.staffRevokeInvitationId}`,
    method: "DELETE",
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "PATCH /api/v1/people/[personId]",
    path: (t) => `/api/v1/people/${t.spareTechId}`,
    method: "PATCH",
    body: () => ({ role: "technician", disabled: false }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/people/[personId]/license",
    path: (t) => `/api/v1/people/${t.spareTechId}/license`,
    method: "PUT",
    body: () => ({ number: "MATRIX-1", category: "Turf", expiresOn: "2030-01-31" }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/people/[personId]/start-point",
    path: (t) => `/api/v1/people/${t.spareTechId}/start-point`,
    method: "PUT",
    body: () => ({ address: "Matrix start", latitude: 40.3, longitude: -74.7 }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "GET /api/v1/people/reassign",
    path: (t) => `/api/v1/people/reassign?from=${t.spareTechId}`,
    allow: ["manager"],
  },
  {
    key: "POST /api/v1/people/reassign",
    path: () => "/api/v1/people/reassign",
    method: "POST",
    body: (t) => ({ fromTechnicianId: t.spareTechId, toTechnicianId: t.assignedTechId }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "DELETE /api/v1/properties/[propertyId]/homeowners/[userId]",
    path: (t) => `/api/v1/properties/${t.propertyId}/homeowners/${t.extraOwnerId}`,
    method: "DELETE",
    allow: ["manager"],
  },
  {
    key: "POST /api/v1/properties/[propertyId]/waterings",
    path: (t) => `/api/v1/properties/${t.propertyId}/waterings`,
    method: "POST",
    body: (t) => ({
      id: randomUUID(),
      zoneId: null,
      wateredOn: t.today,
      depthIn: 0.5,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
    }),
    allow: ownerSide,
  },
  {
    key: "POST /api/v1/properties/[propertyId]/soil-tests",
    path: (t) => `/api/v1/properties/${t.propertyId}/soil-tests`,
    method: "POST",
    body: (t) => ({ ...soilTestBody(t), id: randomUUID() }),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/properties/[propertyId]/soil-tests/import",
    path: (t) => `/api/v1/properties/${t.propertyId}/soil-tests/import`,
    method: "POST",
    body: (t) => ({
      csv: `sampled_on,lab,depth_in,extractant,ph\n${t.today},Matrix import ${randomUUID()},4,mehlich3,6.1`,
    }),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "DELETE /api/v1/soil-tests/[soilTestId]",
    path: () => `/api/v1/soil-tests/${nextOf("deleteSoilTest")}`,
    method: "DELETE",
    before: queue("deleteSoilTest", "soilTest", 1),
    body: () => ({}),
    allow: ["manager"],
    mustSucceed: true,
    after: usedOne("deleteSoilTest"),
  },
  {
    key: "POST /api/v1/visits",
    path: () => "/api/v1/visits",
    method: "POST",
    body: (t) => ({
      propertyId: t.propertyId,
      scheduledFor: t.today,
      technicianId: null,
      plannedService: "inspection",
      confirmSameDay: true, // the demo property has its stop today
    }),
    allow: ["manager"],
    refusedAs: [422],
  },
  {
    key: "POST /api/v1/visits/[visitId]/cancel",
    case: "a stop rained out with a reason (the same call again is a replay)",
    path: (t) => `/api/v1/visits/${t.cancelVisitId}/cancel`,
    method: "POST",
    body: () => ({ outcome: "rained_out", reason: "Rain on the matrix walk" }),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/visits/[visitId]/reschedule",
    case: "the rained-out stop rescheduled (once: the second allowed person gets 409)",
    path: (t) => `/api/v1/visits/${t.cancelVisitId}/reschedule`,
    method: "POST",
    body: (t) => ({ scheduledFor: t.rescheduleOn }),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/schedule/moves",
    case: "a stop weeks ahead moved to another day (confirmed)",
    path: () => "/api/v1/schedule/moves",
    method: "POST",
    body: (t) => ({ visitIds: [t.moveVisitId], toDate: t.moveTo, confirm: true }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/schedule/rain-delays",
    case: "tech1's day weeks ahead rained out (another company has nothing there: 422)",
    path: () => "/api/v1/schedule/rain-delays",
    method: "POST",
    body: (t) => ({ date: t.rainDay, technicianId: t.tech1Id, confirm: true }),
    allow: ["manager"],
    refusedAs: [422],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/schedule/technicians/[technicianId]/capacity",
    path: (t) => `/api/v1/schedule/technicians/${t.tech1Id}/capacity`,
    method: "PUT",
    body: () => ({ capacity: 10 }),
    allow: ["manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/alerts/[alertId]/acknowledge",
    path: (t) => `/api/v1/alerts/${t.alertId}/acknowledge`,
    method: "POST",
    body: () => ({ note: "Seen on the matrix walk" }),
    allow: ["assignedTech", "manager"],
  },
  {
    key: "POST /api/v1/alerts/[alertId]/resolve",
    path: (t) => `/api/v1/alerts/${t.alertId}/resolve`,
    method: "POST",
    body: () => ({ note: "Resolved on the matrix walk" }),
    allow: ["manager"],
  },

  // The field visit, in the order a technician works.
  {
    key: "POST /api/v1/visits/[visitId]/start",
    path: (t) => `/api/v1/visits/${t.visitId}/start`,
    method: "POST",
    body: () => ({ latitude: null, longitude: null }),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "PUT /api/v1/visits/[visitId]/zone-checks/[zoneCheckId]",
    path: (t) => `/api/v1/visits/${t.visitId}/zone-checks/${t.zoneCheckId}`,
    method: "PUT",
    body: (t) => doneCheck(t.zoneId),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
  },
  {
    key: "POST /api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos",
    path: (t) => `/api/v1/visits/${t.visitId}/zone-checks/${t.zoneCheckId}/photos`,
    method: "POST",
    bytes: async () => (await import("@/fixtures/demo/photos")).lawnImage(320, 240, 0.15),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
    after: (t, _persona, body) => {
      t.photoId = (JSON.parse(body) as { id: string }).id;
    },
  },
  {
    key: "GET /api/v1/photos/[photoId]/[variant]",
    case: "a photo of a visit still in progress",
    path: (t) => `/api/v1/photos/${t.photoId}/thumb`,
    allow: ["assignedTech", "manager"],
  },
  {
    key: "POST /api/v1/visits/[visitId]/applications",
    path: (t) => `/api/v1/visits/${t.visitId}/applications`,
    method: "POST",
    body: (t) => ({
      id: randomUUID(),
      zoneId: t.zoneId,
      productId: t.productId,
      rateAmount: 1,
      rateUnit: "lb/1000ft2",
      windMph: null,
      temperatureF: null,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: null,
    }),
    allow: ["assignedTech", "manager"],
  },
  // Corrections and deletions while the visit is open: the entry's author (tech1, the assigned
  // technician) or a manager. Each cell makes its own entries (one per allowed person for a delete).
  {
    key: "PUT /api/v1/applications/[applicationId]",
    path: () => `/api/v1/applications/${nextOf("putApplication")}`,
    method: "PUT",
    before: queue("putApplication", "application", 1),
    body: (t) => applicationBody(t),
    allow: ["assignedTech", "manager"],
  },
  {
    key: "DELETE /api/v1/applications/[applicationId]",
    path: () => `/api/v1/applications/${nextOf("deleteApplication")}`,
    method: "DELETE",
    before: queue("deleteApplication", "application", 2),
    body: () => ({}),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
    after: usedOne("deleteApplication"),
  },
  {
    key: "DELETE /api/v1/photos/[photoId]",
    path: () => `/api/v1/photos/${nextOf("deletePhoto")}`,
    method: "DELETE",
    before: queue("deletePhoto", "photo", 2),
    body: () => ({}),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
    after: usedOne("deletePhoto"),
  },
  {
    key: "DELETE /api/v1/visits/[visitId]/zone-checks/[zoneCheckId]",
    path: (t) => `/api/v1/visits/${t.visitId}/zone-checks/${nextOf("deleteZoneCheck")}`,
    method: "DELETE",
    before: queue("deleteZoneCheck", "zoneCheck", 2),
    body: () => ({}),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
    after: usedOne("deleteZoneCheck"),
  },
  {
    key: "PUT /api/v1/waterings/[wateringId]",
    path: () => `/api/v1/waterings/${nextOf("putWatering")}`,
    method: "PUT",
    before: queue("putWatering", "watering", 1),
    body: (t) => ({
      id: nextOf("putWatering"),
      zoneId: null,
      wateredOn: t.today,
      depthIn: 0.6,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
    }),
    allow: ["owner", "manager"], // the homeowner's own entry; the technician did not log it (403)
    mustSucceed: true,
  },
  {
    key: "DELETE /api/v1/waterings/[wateringId]",
    path: () => `/api/v1/waterings/${nextOf("deleteWatering")}`,
    method: "DELETE",
    before: queue("deleteWatering", "watering", 2),
    body: () => ({}),
    allow: ["owner", "manager"],
    mustSucceed: true,
    after: usedOne("deleteWatering"),
  },
  {
    key: "POST /api/v1/visits/[visitId]/finish",
    path: (t) => `/api/v1/visits/${t.visitId}/finish`,
    method: "POST",
    body: () => ({}),
    allow: ["assignedTech", "manager"],
    mustSucceed: true,
    before: (x) => checkEveryZone(x),
  },
  {
    key: "GET /api/v1/photos/[photoId]/[variant]",
    case: "the same photo once the visit is finished (its report is the homeowner's)",
    path: (t) => `/api/v1/photos/${t.photoId}/display`,
    allow: ownerSide,
  },

  // Server actions: public by nature (signing in and out); each is also an HTTP endpoint, posted to below.
  {
    key: "ACTION lib/auth/actions.ts#signInAction",
    path: () => "/sign-in",
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "ACTION lib/auth/actions.ts#requestSignInLinkAction",
    path: () => "/sign-in",
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "ACTION lib/invitations/actions.ts#acceptInvitationAction",
    case: "needs the token of a pending invitation; an empty form is an error state",
    path: () => "/invitation",
    allow: PERSONAS,
    isPublic: true,
  },
  {
    key: "ACTION lib/auth/actions.ts#signOutAction",
    path: () => "/properties",
    allow: PERSONAS,
    isPublic: true,
  },
];

/** A valid season program: one lime round (no nitrogen), named uniquely. */
function programBody(id: string, name = `Matrix program ${randomUUID().slice(0, 6)}`) {
  const none = { productId: null, target: "none", nLb: null };
  return {
    id,
    name,
    grassSeason: "cool",
    notes: "",
    rounds: [
      {
        kind: "lime",
        windowKind: "dates",
        startMd: "03-01",
        endMd: "03-31",
        triggerBaseF: null,
        triggerValue: null,
        windowDays: null,
        granular: none,
        liquid: none,
      },
    ],
  };
}

function ruleSetBody(name: string) {
  return {
    name,
    citation: "",
    limitsAreLaw: false,
    maxNLbPer1000: 1,
    maxWsnLbPer1000: null,
    minSlowReleasePct: null,
    proBlackout: null,
    homeownerBlackout: null,
    phosphorusRule: "allowed",
    soilTestMaxAgeYears: null,
    recordRetentionYears: 3,
    recordRequiredFields: [],
    recordFieldsApplyTo: "pesticides",
  };
}

/** Every endpoint the app has, read from the file system: route handlers' methods, pages, and exported server actions. */
function endpointsOfTheApp(): string[] {
  const keys: string[] = [];
  const walk = (dir: string): string[] =>
    readdirSync(dir, { withFileTypes: true }).flatMap((e) =>
      e.isDirectory() ? walk(path.join(dir, e.name)) : [path.join(dir, e.name)],
    );
  const urlOf = (file: string) =>
    "/" +
    path
      .dirname(path.relative("app", file))
      .split(path.sep)
      .filter((s) => s !== "." && !/^\(.*\)$/.test(s))
      .join("/");
  for (const file of walk("app")) {
    const src = readFileSync(file, "utf8");
    if (file.endsWith("route.ts"))
      for (const m of src.matchAll(
        /export (?:const|async function) (GET|POST|PUT|PATCH|DELETE)\b/g,
      ))
        keys.push(`${m[1]} ${urlOf(file)}`);
    if (file.endsWith("page.tsx")) keys.push(`PAGE ${urlOf(file).replace(/^\/$/, "/")}`);
  }
  for (const file of [...walk("app"), ...walk("lib")].filter((f) => /\.tsx?$/.test(f))) {
    const src = readFileSync(file, "utf8");
    if (!/^\s*["']use server["']/m.test(src)) continue;
    for (const m of src.matchAll(/export async function (\w+)/g))
      keys.push(`ACTION ${file}#${m[1]}`);
  }
  return [...new Set(keys)].sort();
}

let t: Targets;
const cookies = new Map<Persona, string>();

beforeAll(async () => {
  useE2eDatabase();
  const [
    { createTestCompany, testDb },
    { otherCompany },
    { evaluateProperty },
    { scheduleVisit },
    { acceptInvitation, inviteHomeowner, inviteStaff },
    { invitationTokenFor },
    { addDays, todayIn },
  ] = await Promise.all([
    import("../helpers/factories"),
    import("@/fixtures/demo/scenario"),
    import("@/lib/after-write/sweep"),
    import("@/lib/visits/mutations"),
    import("@/lib/invitations/mutations"),
    import("../helpers/invitations"),
    import("@/lib/dates"),
  ]);
  const [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  const db = testDb();
  const propertyId = c.propertyIds["oyelaran"]!;
  await evaluateProperty(db, c.companyId, propertyId, { provider: null });
  const manager = await c.actor("manager");
  const property = await db
    .selectFrom("properties")
    .selectAll()
    .where("id", "=", propertyId)
    .executeTakeFirstOrThrow();
  const zone = await db
    .selectFrom("zones")
    .selectAll()
    .where("property_id", "=", propertyId)
    .orderBy("sort_order")
    .executeTakeFirstOrThrow();
  const visit = await db
    .selectFrom("visits")
    .select("id")
    .where("property_id", "=", propertyId)
    .where("status", "=", "scheduled")
    .executeTakeFirstOrThrow();
  const completed = await db
    .selectFrom("visits")
    .select("id")
    .where("property_id", "=", propertyId)
    .where("status", "=", "completed")
    .orderBy("scheduled_for", "desc")
    .executeTakeFirstOrThrow();
  const alert = await db
    .selectFrom("risk_alerts")
    .select("id")
    .where("property_id", "=", propertyId)
    .where("status", "=", "open")
    .executeTakeFirstOrThrow();
  const product = await db
    .selectFrom("products")
    .select(["id", "name"])
    .where("company_id", "=", c.companyId)
    .orderBy("name")
    .executeTakeFirstOrThrow();
  const ruleSet = await db
    .selectFrom("rule_sets")
    .select(["id", "name"])
    .where("company_id", "=", c.companyId)
    .executeTakeFirstOrThrow();
  // The program the property follows (the demo seeds it).
  const program = await db
    .selectFrom("programs")
    .innerJoin("properties", "properties.program_id", "programs.id")
    .select(["programs.id", "programs.name"])
    .where("properties.id", "=", propertyId)
    .executeTakeFirstOrThrow();
  const today = todayIn(property.time_zone);
  const cancelVisitId = randomUUID();
  await scheduleVisit(manager, {
    id: cancelVisitId,
    propertyId,
    scheduledFor: today,
    technicianId: c.userIds["tech1"]!,
    plannedService: "inspection",
    stopOrder: 0,
    notes: "",
    confirmSameDay: true,
  });
  // A day the property has no visit, not a Sunday: the rained-out stop's new day.
  const taken = new Set(
    (
      await db
        .selectFrom("visits")
        .select("scheduled_for")
        .where("property_id", "=", propertyId)
        .where("status", "!=", "cancelled")
        .execute()
    ).map((v) => v.scheduled_for),
  );
  let rescheduleOn = addDays(today, 1);
  while (taken.has(rescheduleOn) || new Date(`${rescheduleOn}T00:00:00Z`).getUTCDay() === 0)
    rescheduleOn = addDays(rescheduleOn, 1);
  // A stop weeks ahead to move, and another on a day to rain out (Wednesdays: working days).
  let moveDay = addDays(today, 35);
  while (new Date(`${moveDay}T00:00:00Z`).getUTCDay() !== 3) moveDay = addDays(moveDay, 1);
  const moveVisitId = randomUUID();
  const rainDay = addDays(moveDay, 7);
  for (const [id, day] of [
    [moveVisitId, moveDay],
    [randomUUID(), rainDay],
  ] as const)
    await scheduleVisit(manager, {
      id,
      propertyId,
      scheduledFor: day,
      technicianId: c.userIds["tech1"]!,
      plannedService: "inspection",
      stopOrder: 1,
      notes: "",
      confirmSameDay: true,
    });
  const extraEmail = `matrix-extra-${randomUUID().slice(0, 8)}@test.sward.test`;
  await inviteHomeowner(manager, propertyId, { email: extraEmail, name: "Matrix Extra" });
  await acceptInvitation(await invitationTokenFor(db, extraEmail), {
    password: "matrix-extra-password-2026",
  });
  const invitationEmail = `matrix-invited-${randomUUID().slice(0, 8)}@test.sward.test`;
  const invitation = await inviteHomeowner(manager, propertyId, {
    email: invitationEmail,
    name: "Matrix Invited",
  });
  const toRevoke = await inviteHomeowner(manager, propertyId, {
    email: `matrix-withdrawn-${randomUUID().slice(0, 8)}@test.sward.test`,
    name: "Matrix Withdrawn",
  });
  const extra = await db
    .selectFrom("users")
    .select("id")
    .where("email", "=", extraEmail)
    .executeTakeFirstOrThrow();
  const spareEmail = `matrix-spare-${randomUUID().slice(0, 8)}@test.sward.test`;
  await inviteStaff(manager, { email: spareEmail, name: "Matrix Spare", role: "technician" });
  const spare = await acceptInvitation(
    await invitationTokenFor(db, spareEmail, "staff_invitation"),
    {
      password: "matrix-spare-password-2026",
    },
  );
  const staffInvitation = await inviteStaff(manager, {
    email: `matrix-staff-invited-${randomUUID().slice(0, 8)}@test.sward.test`,
    name: "Matrix Staff Invited",
    role: "manager",
  });
  const staffToRevoke = await inviteStaff(manager, {
    email: `matrix-staff-withdrawn-${randomUUID().slice(0, 8)}@test.sward.test`,
    name: "Matrix Staff Withdrawn",
    role: "technician",
  });
  t = {
    propertyId,
    propertyName: property.name,
    street: property.street,
    zoneId: zone.id,
    visitId: visit.id,
    cancelVisitId,
    rescheduleOn,
    moveVisitId,
    moveTo: addDays(moveDay, 1),
    rainDay,
    tech1Id: c.userIds["tech1"]!,
    completedVisitId: completed.id,
    alertId: alert.id,
    productId: product.id,
    productName: product.name,
    ruleSetId: ruleSet.id,
    ruleSetName: ruleSet.name,
    programId: program.id,
    programName: program.name,
    zoneName: zone.name,
    extraOwnerId: extra.id,
    invitationId: invitation.id,
    invitationEmail,
    revokeInvitationId: toRevoke.id,
    staffInvitationId: staffInvitation.id,
    staffRevokeInvitationId: staffToRevoke.id,
    spareTechId: spare.userId,
    assignedTechId: c.userIds["tech1"]!,
    zoneCheckId: randomUUID(),
    photoId: randomUUID(),
    ownerEmail: c.emails["owner1"]!,
    propertyBody: {
      name: property.name,
      street: property.street,
      city: property.city,
      region: property.region,
      postalCode: property.postal_code,
      latitude: property.latitude,
      longitude: property.longitude,
      timeZone: property.time_zone,
      ruleSetId: property.rule_set_id,
      technicianId: property.technician_id,
      notes: property.notes,
    },
    zoneBody: {
      name: zone.name,
      area: zone.area_ft2,
      areaUnit: "ft2",
      grassSpecies: zone.grass_species,
      sunExposure: zone.sun_exposure,
      isIrrigated: zone.is_irrigated,
      slope: zone.slope,
    },
    today,
  };
  const { saveZoneCheck } = await import("@/lib/visits/mutations");
  readTech1Day = async (targets) => {
    const rows = await db
      .selectFrom("visits")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("technician_id", "=", targets.tech1Id)
      .where("scheduled_for", "=", targets.today)
      .orderBy("stop_order", "desc")
      .orderBy("id")
      .execute();
    tech1Day = rows.map((r) => r.id);
  };
  makeProgram = async () => {
    const { createProgram } = await import("@/lib/programs/mutations");
    const id = randomUUID();
    await createProgram(manager, programBody(id) as Parameters<typeof createProgram>[1]);
    return id;
  };
  makeEntry = async (kind, targets) => {
    const id = randomUUID();
    const tech1 = c.userIds["tech1"]!;
    if (kind === "application") {
      await db
        .insertInto("applications")
        .values({
          id,
          company_id: c.companyId,
          visit_id: targets.visitId,
          zone_id: targets.zoneId,
          product_id: targets.productId,
          rate_amount: 1,
          rate_unit: "lb/1000ft2",
          area_ft2: 1000,
          product_total_lb: 1,
          product_total_gal: null,
          n_lb_per_1000: 0,
          p2o5_lb_per_1000: 0,
          k2o_lb_per_1000: 0,
          wsn_lb_per_1000: 0,
          applied_on: targets.today,
          applied_at: new Date(),
          wind_mph: null,
          temperature_f: null,
          findings: "[]",
          override_reason: null,
          override_category: null,
          override_by: null,
          created_by: tech1,
        })
        .execute();
    } else if (kind === "photo") {
      const hash = `${randomUUID()}${randomUUID()}`.replaceAll("-", ""); // 64 hex digits, as a SHA-256
      await db
        .insertInto("photos")
        .values({
          id,
          company_id: c.companyId,
          visit_id: targets.visitId,
          zone_check_id: targets.zoneCheckId,
          zone_id: targets.zoneId,
          property_id: targets.propertyId,
          content_hash: hash,
          original_format: "jpeg",
          original_bytes: 1000,
          width: 320,
          height: 240,
          display_key: `${c.companyId}/${hash}-display.webp`,
          display_width: 320,
          display_height: 240,
          thumb_key: `${c.companyId}/${hash}-thumb.webp`,
          green_cover_pct: 50,
          dgci: 0.5,
          measured_by: "canopy-rule-2015",
          dark_pct: 0,
          clipped_pct: 0,
          captured_local: null,
          gps_latitude: null,
          gps_longitude: null,
          uploaded_by: tech1,
        })
        .execute();
    } else if (kind === "zoneCheck") {
      // A zone of the visit without a check yet (finishing checks every zone again).
      const free = await db
        .selectFrom("zones")
        .select("id")
        .where("property_id", "=", targets.propertyId)
        .where("archived_at", "is", null)
        .where((eb) =>
          eb.not(
            eb.exists(
              eb
                .selectFrom("zone_checks")
                .select("zone_checks.id")
                .whereRef("zone_checks.zone_id", "=", "zones.id")
                .where("zone_checks.visit_id", "=", targets.visitId),
            ),
          ),
        )
        .executeTakeFirstOrThrow();
      await saveZoneCheck(await c.actor("tech1"), targets.visitId, id, doneCheck(free.id));
    } else if (kind === "soilTest") {
      await db
        .insertInto("soil_tests")
        .values({
          id,
          company_id: c.companyId,
          property_id: targets.propertyId,
          zone_id: null,
          sampled_on: targets.today,
          lab: `Matrix lab ${id}`,
          depth_in: 4,
          extractant: "mehlich3",
          ph: 6.2,
          buffer_ph: null,
          buffer_method: null,
          organic_matter_pct: null,
          p_ppm: 20,
          k_ppm: null,
          ca_ppm: null,
          mg_ppm: null,
          s_ppm: null,
          lab_lime_lb_per_1000: null,
          lab_p_needed: null,
          recorded_by: c.userIds["manager"]!,
        })
        .execute();
    } else {
      await db
        .insertInto("waterings")
        .values({
          id,
          company_id: c.companyId,
          property_id: targets.propertyId,
          zone_id: null,
          watered_on: targets.today,
          depth_in: 0.5,
          run_minutes: null,
          precipitation_rate_in_per_h: null,
          entered_by_role: "homeowner",
          created_by: c.userIds["owner1"]!,
        })
        .execute();
    }
    return id;
  };
  checkEveryZone = async (targets) => {
    const tech = await c.actor("tech1");
    const open = await db
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", targets.propertyId)
      .where("archived_at", "is", null)
      .where((eb) =>
        eb.not(
          eb.exists(
            eb
              .selectFrom("zone_checks")
              .select("zone_checks.id")
              .whereRef("zone_checks.zone_id", "=", "zones.id")
              .where("zone_checks.visit_id", "=", targets.visitId),
          ),
        ),
      )
      .execute();
    for (const z of open) await saveZoneCheck(tech, targets.visitId, randomUUID(), doneCheck(z.id));
  };
  // Session cookies as sign-in issues them (a session row, its id in the encrypted JWT).
  const people: Record<Exclude<Persona, "anonymous">, string> = {
    owner: c.userIds["owner1"]!,
    otherOwner: c.userIds["owner2"]!,
    assignedTech: c.userIds["tech1"]!,
    otherTech: c.userIds["tech2"]!,
    manager: c.userIds["manager"]!,
    otherManager: other.userIds["manager"]!,
  };
  for (const [persona, userId] of Object.entries(people) as [Persona, string][])
    cookies.set(persona, await mintSessionCookie(userId));
  // The unassigned technician must have no open visit at the property (that would put it in their scope).
  expect(
    await db
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", propertyId)
      .where("technician_id", "=", c.userIds["tech2"]!)
      .where("status", "in", ["scheduled", "in_progress"])
      .execute(),
  ).toEqual([]);
}, 120_000);

/** The action ids of the build, by exported name (Next's server-reference manifest). */
function actionIds(): Map<string, string> {
  const manifest = JSON.parse(
    readFileSync(".next/server/server-reference-manifest.json", "utf8"),
  ) as { node: Record<string, { exportedName?: string; filename?: string }> };
  return new Map(
    Object.entries(manifest.node).map(([id, entry]) => [
      `${entry.filename ?? ""}#${entry.exportedName ?? ""}`,
      id,
    ]),
  );
}

type Variant = { name: string; url: (p: string) => string; headers: Record<string, string> };
const VARIANTS: Variant[] = [
  { name: "plain", url: (p) => p, headers: {} },
  {
    name: "forged x-middleware-subrequest",
    url: (p) => p,
    headers: {
      "x-middleware-subrequest": "middleware:middleware:middleware:middleware:middleware",
    },
  },
  {
    name: "RSC request",
    url: (p) => `${p}${p.includes("?") ? "&" : "?"}_rsc=m4tr1x`,
    headers: { RSC: "1" },
  },
  {
    name: "RSC prefetch",
    url: (p) => `${p}${p.includes("?") ? "&" : "?"}_rsc=m4tr1x`,
    headers: { RSC: "1", "Next-Router-Prefetch": "1" },
  },
  {
    name: ".rsc URL",
    url: (p) => (p.includes("?") ? p.replace("?", ".rsc?") : `${p}.rsc`),
    headers: { RSC: "1" },
  },
];

/** One request of a cell as a person, in one variant; an RSC request whose `_rsc` key Next corrects is followed once. */
async function send(
  cell: Cell,
  persona: Persona,
  variant: Variant,
  actions: Map<string, string>,
): Promise<{ status: number; text: string }> {
  const headers: Record<string, string> = { ...variant.headers };
  const cookie = cookies.get(persona);
  if (cookie) headers.cookie = cookie;
  let body: BodyInit | undefined;
  let method: string = cell.method ?? "GET";
  if (cell.key.startsWith("ACTION ")) {
    const id = actions.get(cell.key.slice("ACTION ".length));
    if (!id) throw new Error(`${cell.key} has no action id in the build`);
    method = "POST";
    headers["next-action"] = id;
    if (cell.key.endsWith("#signOutAction")) {
      headers["content-type"] = "text/plain;charset=UTF-8";
      body = "[]"; // no argument
    } else {
      const form = new FormData(); // (previous state, an empty form): an error state, never a 5xx
      form.set("0", JSON.stringify([{}, "$K1"]));
      body = form;
    }
  } else if (cell.bytes) {
    headers["content-type"] = "image/jpeg";
    body = new Uint8Array(await cell.bytes());
  } else if (cell.body) {
    headers["content-type"] = "application/json";
    body = JSON.stringify(cell.body(t));
  }
  if (method !== "GET") headers.origin = BASE; // as a browser sends it on every same-site write
  let res = await fetch(`${BASE}${variant.url(cell.path(t))}`, {
    method,
    headers,
    body,
    redirect: "manual",
  });
  const location = res.headers.get("location");
  if (headers.RSC && res.status === 307 && location?.includes("_rsc=")) {
    await res.arrayBuffer();
    res = await fetch(new URL(location, BASE), { method, headers, redirect: "manual" });
  }
  return { status: res.status, text: await res.text() };
}

describe("the authorisation matrix", () => {
  it("lists every route handler, page and server action of the app", () => {
    const inMatrix = [...new Set(CELLS.map((c) => c.key))].sort();
    expect(
      endpointsOfTheApp(),
      "an endpoint missing from the matrix (or a matrix row for one that is gone)",
    ).toEqual(inMatrix);
  });

  it("walks every cell: 0 unexpected allows, 0 unexpected denies", async () => {
    const unexpected: string[] = [];
    let checked = 0;
    let unexpectedAllows = 0;
    let unexpectedDenies = 0;
    const actions = actionIds();
    for (const cell of CELLS) {
      const isPage = cell.key.startsWith("PAGE ");
      const expected = (p: Persona) =>
        cell.allow.includes(p) ? "allow" : cell.hidden?.includes(p) ? "hidden" : "deny";
      // Denied and hidden people first, so an allowed write cannot change what they would see.
      const order = [...PERSONAS].sort(
        (a, b) => Number(expected(a) === "allow") - Number(expected(b) === "allow"),
      );
      await cell.before?.(t);
      let succeeded = false;
      for (const persona of order) {
        const want = expected(persona);
        const variants =
          want === "allow"
            ? VARIANTS.slice(0, 1)
            : isPage
              ? VARIANTS
              : cell.method && cell.method !== "GET"
                ? VARIANTS.slice(0, 2)
                : VARIANTS.slice(0, 3);
        for (const variant of variants) {
          const { status, text } = await send(cell, persona, variant, actions);
          checked++;
          // Pages echo their URL (ids included) in the payload, so a page's trace is the property's name and street.
          const leaks = (
            cell.leak ??
            ((x: Targets) =>
              isPage ? [x.propertyName, x.street] : [x.propertyName, x.street, x.propertyId])
          )(t).filter((m) => m && text.includes(m));
          const marker = cell.marker?.(t);
          const isRsc = variant.headers.RSC === "1";
          const refused = isPage
            ? (status >= 300 && status < 400) ||
              status === 404 ||
              (isRsc &&
                status === 200 &&
                /NEXT_REDIRECT|NEXT_HTTP_ERROR_FALLBACK|NEXT_NOT_FOUND/.test(text))
            : [401, 403, 404, ...(cell.refusedAs ?? [])].includes(status) ||
              (isRsc && status === 307 && text === ""); // Next answers an RSC request to a route handler with an empty redirect
          let ok: boolean;
          if (status >= 500) ok = false;
          else if (cell.isPublic) ok = true;
          else if (want === "allow") ok = !refused && (!marker || text.includes(marker));
          // An RSC or prefetch answer may be 200 with only the route tree: it must show neither the page's marker nor the property.
          else if (isRsc)
            ok =
              (refused || status === 200) &&
              leaks.length === 0 &&
              !(marker && text.includes(marker));
          else if (want === "hidden") ok = status >= 200 && status < 300 && leaks.length === 0;
          else
            ok =
              refused &&
              leaks.length === 0 &&
              (persona !== "anonymous" || isPage || status === 401 || status === 404);
          if (!ok) {
            if (want === "allow" && !cell.isPublic) unexpectedDenies++;
            else unexpectedAllows++;
            unexpected.push(
              `${cell.key}${cell.case ? ` (${cell.case})` : ""} × ${persona} [${variant.name}]: expected ${want}, got ${status}${leaks.length ? ` showing ${leaks.join(", ")}` : ""}${marker && want === "allow" && !text.includes(marker) ? " without its marker" : ""} — ${text.slice(0, 160).replace(/\s+/g, " ")}`,
            );
          } else if (want === "allow") {
            if (status >= 200 && status < 300) succeeded = true;
            cell.after?.(t, persona, text);
          }
        }
      }
      if (cell.mustSucceed && !succeeded)
        unexpected.push(`${cell.key}: no allowed person's request succeeded`);
    }
    console.log(
      `authorisation matrix: ${CELLS.length} rows × ${PERSONAS.length} people; cells checked ${checked}, unexpected allows ${unexpectedAllows}, unexpected denies ${unexpectedDenies}`,
    );
    expect(unexpected).toEqual([]);
  }, 240_000);
});
