// The one typed view of Sward's database. Table interfaces describe columns; query results use
// the Selectable/Insertable aliases below (add one when a module needs it). Nullable columns are `T | null`, never optional.
import type { ColumnType, Generated, GeneratedAlways, Insertable, Selectable } from "kysely";

type Timestamp = ColumnType<Date, Date | string | undefined, Date | string>;
type NullableTimestamp = ColumnType<
  Date | null,
  Date | string | null | undefined,
  Date | string | null
>;

export type Role = "manager" | "technician" | "homeowner";
type UnitSystem = "imperial" | "metric";
export type SunExposure = "full_sun" | "part_shade" | "shade";
export type Slope = "flat" | "moderate" | "steep";
export type PlannedService =
  | "feeding_round"
  | "weed_control"
  | "insect_control"
  | "aeration_overseeding"
  | "fall_feeding"
  | "inspection"
  | "callback"
  | "soil_sampling"
  | "liming";
export type VisitStatus = "scheduled" | "in_progress" | "completed" | "cancelled";
/** Why a canceled visit did not happen (null for visits canceled before outcomes were kept). */
export type CancelKind = "cancelled" | "rained_out";
export type ZoneCheckStatus = "draft" | "done" | "skipped";
export type SoilMoisture = "dry" | "moist" | "wet";
export type MowingDirection = "same" | "changed" | "unknown";
export type SkipReason = "no_access" | "construction" | "dog_in_yard" | "other";

/** One observed symptom in a zone check (stored as jsonb; validated by lib/visits/schemas.ts). */
export interface ObservedSymptom {
  key: string;
  severity: 1 | 2 | 3;
  extentPct: number;
}

interface CompaniesTable {
  id: Generated<string>;
  name: string;
  slug: string;
  unit_system: ColumnType<UnitSystem, UnitSystem | undefined, UnitSystem>;
  time_zone: Generated<string>;
  /** BCP 47 language-region (lib/i18n/locales.ts): words, dates and units of screens, e-mails, exports. */
  locale: Generated<string>;
  /** Pressure areas (lib/risk/pressure-areas.ts): Eps1 in miles, Eps2 in days, MinPts in properties. */
  pressure_distance_mi: Generated<number>;
  pressure_days: Generated<number>;
  pressure_min_properties: Generated<number>;
  created_at: Generated<Date>;
  /** Where a day's route starts and ends (the technician's own start point takes its place). */
  yard_address: Generated<string>;
  yard_latitude: number | null;
  yard_longitude: number | null;
}

type PhosphorusRule = "allowed" | "soil_test_or_establishment";

interface RuleSetsTable {
  id: Generated<string>;
  company_id: string;
  name: string;
  citation: Generated<string>;
  limits_are_law: Generated<boolean>;
  max_n_lb_per_1000: number | null;
  max_wsn_lb_per_1000: number | null;
  min_slow_release_pct: number | null;
  /** No fertilizer after this month-day (the day itself allowed), as the statute words it. */
  pro_no_fertilizer_after: string | null;
  /** …nor before this month-day (the day itself allowed). */
  pro_no_fertilizer_before: string | null;
  homeowner_no_fertilizer_after: string | null;
  homeowner_no_fertilizer_before: string | null;
  phosphorus_rule: Generated<PhosphorusRule>;
  soil_test_max_age_years: number | null;
  phosphorus_exempt_establishment: Generated<boolean>;
  phosphorus_exempt_repair: Generated<boolean>;
  /** The section that states each limit ("" when the rule set has none). */
  n_limits_source: Generated<string>;
  blackout_source: Generated<string>;
  phosphorus_source: Generated<string>;
  /** Non-empty when the rule set names frozen or saturated ground and heavy rain. */
  conditions_source: Generated<string>;
  record_retention_years: Generated<number>;
  record_required_fields: ColumnType<string[], string[] | undefined, string[]>;
  record_fields_apply_to: Generated<"pesticides" | "all">;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

export type ProductFormValue = "granular" | "liquid" | "soluble";
export type NitrogenRelease = "quick" | "slow_release" | "organic";
export type RateUnitValue =
  | "lb/1000ft2"
  | "oz/1000ft2"
  | "floz/1000ft2"
  | "gal/1000ft2"
  | "kg/ha"
  | "g/m2"
  | "lb/acre"
  | "L/ha";
type OverrideCategoryValue =
  "documented_exemption" | "research_plot" | "regulator_permission" | "other";

type PreEmergenceActiveValue =
  "prodiamine" | "dithiopyr" | "pendimethalin" | "siduron" | "mesotrione" | "other";

interface ProductsTable {
  id: Generated<string>;
  company_id: string;
  name: string;
  form: ProductFormValue;
  n_pct: number;
  p2o5_pct: number;
  k2o_pct: number;
  slow_release_pct_of_n: Generated<number>;
  density_lb_per_gal: number | null;
  is_pesticide: Generated<boolean>;
  registration_number: Generated<string>;
  label_cautions: Generated<string>;
  reentry_guidance: Generated<string>;
  /** The label's maximum rate per application, in label_rate_unit. */
  label_max_rate: number | null;
  label_rate_unit: RateUnitValue | null;
  /** The label's maximum per year (365 days), in label_rate_unit. */
  label_max_yearly: number | null;
  label_min_interval_days: number | null;
  n_release: Generated<NitrogenRelease>;
  /** A pre-emergence herbicide's active ingredient class (lib/agronomy/seeding.ts); null: not one. */
  pre_emergence_active: Generated<PreEmergenceActiveValue | null>;
  /** The label's days between this pre-emergence and seeding the same turf; null: not entered. */
  seeding_interval_days: Generated<number | null>;
  /** The grass species key of a seed product; null: not seed. */
  seed_species: Generated<string | null>;
  archived_at: NullableTimestamp;
  created_at: Generated<Date>;
}

interface ApplicationsTable {
  id: string;
  company_id: string;
  visit_id: string;
  zone_id: string;
  product_id: string;
  rate_amount: number;
  rate_unit: RateUnitValue;
  area_ft2: number;
  product_total_lb: number;
  product_total_gal: number | null;
  n_lb_per_1000: number;
  p2o5_lb_per_1000: number;
  k2o_lb_per_1000: number;
  wsn_lb_per_1000: number;
  applied_on: ColumnType<string, string, string>;
  applied_at: Timestamp;
  wind_mph: number | null;
  temperature_f: number | null;
  is_establishing: Generated<boolean>;
  is_repairing: Generated<boolean>;
  applicator_name: Generated<string>;
  applicator_licence: Generated<string>;
  findings: ColumnType<unknown[], string, string>;
  override_reason: string | null;
  override_category: OverrideCategoryValue | null;
  override_by: string | null;
  created_by: string | null;
  created_at: Generated<Date>;
}

interface UsersTable {
  id: Generated<string>;
  email: string;
  name: string;
  password_hash: string | null;
  email_verified: NullableTimestamp;
  image: string | null;
  disabled_at: NullableTimestamp;
  created_at: Generated<Date>;
  /** The applicator's name and license number this person last recorded on a pesticide application. */
  applicator_name: Generated<string>;
  applicator_license: Generated<string>;
  /** The technician's applicator license on record: number, category, expiry ('' / null: none). */
  license_number: Generated<string>;
  license_category: Generated<string>;
  license_expires_on: ColumnType<string | null, string | null | undefined, string | null>;
}

interface MembershipsTable {
  id: Generated<string>;
  company_id: string;
  user_id: string;
  role: Role;
  created_at: Generated<Date>;
  /** Stops a day the technician can do (the week's capacity bar). */
  daily_stop_capacity: Generated<number>;
  /** The technician's own start point of a day's route (home, a second yard); null: the company's yard. */
  start_label: Generated<string>;
  start_latitude: number | null;
  start_longitude: number | null;
}

/** OAuth/e-mail provider accounts, as Auth.js models them. */
interface AuthAccountsTable {
  id: Generated<string>;
  user_id: string;
  type: string;
  provider: string;
  provider_account_id: string;
  refresh_token: string | null;
  access_token: string | null;
  expires_at: number | null;
  token_type: string | null;
  scope: string | null;
  id_token: string | null;
  session_state: string | null;
}

/** One row per signed-in browser; the JWT carries its id, sign-out deletes it. */
interface AuthSessionsTable {
  id: string;
  user_id: string;
  expires_at: Timestamp;
  created_at: Generated<Date>;
  last_seen_at: Generated<Date>;
}

/** E-mail sign-in tokens (stored hashed), single use. */
interface VerificationTokensTable {
  identifier: string;
  token: string;
  expires: Timestamp;
}

interface SignInAttemptsTable {
  id: Generated<string>;
  email_key: string;
  address: string;
  succeeded: boolean;
  attempted_at: Generated<Date>;
}

interface SignInLinkRequestsTable {
  id: Generated<string>;
  email_key: string;
  address: string;
  requested_at: Generated<Date>;
}

/** A manager's invitation of an e-mail address to a property (lib/invitations). */
interface HomeownerInvitationsTable {
  id: Generated<string>;
  company_id: string;
  /** The property a homeowner is invited to; null for a staff invitation. */
  property_id: string | null;
  /** Who the person becomes on accepting: a homeowner of the property, or staff of the company. */
  role: Generated<Role>;
  email: string;
  name: string;
  /** sha256 of the token and AUTH_SECRET; the token itself travels only in the e-mail. */
  token_hash: string;
  expires_at: Timestamp;
  invited_by: string | null;
  sent_at: Generated<Date>;
  send_count: Generated<number>;
  accepted_at: NullableTimestamp;
  accepted_user_id: string | null;
  revoked_at: NullableTimestamp;
  revoked_by: string | null;
  created_at: Generated<Date>;
}

interface PropertiesTable {
  id: Generated<string>;
  company_id: string;
  name: string;
  street: string;
  city: string;
  region: string;
  postal_code: string;
  latitude: number;
  longitude: number;
  time_zone: string;
  technician_id: string | null;
  rule_set_id: string | null;
  /** The season program the property follows (lib/programs), or none. */
  program_id: Generated<string | null>;
  notes: Generated<string>;
  /** E.164, e.g. +16095550142 (lib/reference/us-phone.ts). */
  customer_phone: string | null;
  /** Gate code, dog in the yard: shown on the technician's stop. */
  access_notes: Generated<string>;
  archived_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  /** lower(name street city postal_code), for the book's text search (trigram index). */
  search_text: GeneratedAlways<string>;
}

interface PropertyHomeownersTable {
  property_id: string;
  user_id: string;
  company_id: string;
}

interface ZonesTable {
  id: Generated<string>;
  company_id: string;
  property_id: string;
  name: string;
  area_ft2: number;
  grass_species: string;
  sun_exposure: SunExposure;
  is_irrigated: boolean;
  slope: Slope;
  /** How the zone is fed in its property's program. */
  program_method: Generated<ProgramMethod>;
  /** The season (year) the zone is left out of its program, with the reason; both or neither. */
  program_excluded_year: Generated<number | null>;
  program_excluded_reason: Generated<string | null>;
  sort_order: Generated<number>;
  archived_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

interface VisitsTable {
  id: string;
  company_id: string;
  property_id: string;
  technician_id: string | null;
  /** Calendar date (YYYY-MM-DD) in the property's time zone. */
  scheduled_for: ColumnType<string, string, string>;
  stop_order: Generated<number>;
  planned_service: PlannedService;
  status: Generated<VisitStatus>;
  notes: Generated<string>;
  started_at: NullableTimestamp;
  started_by: string | null;
  start_latitude: number | null;
  start_longitude: number | null;
  completed_at: NullableTimestamp;
  completed_by: string | null;
  version: Generated<number>;
  created_by: string | null;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  /** Weather of the visit day as known when the visit started, or { status: "unavailable" }. */
  weather: ColumnType<Record<string, unknown> | null, string | null | undefined, string | null>;
  /** A canceled stop: rained out or canceled, the reason given, who and when. */
  cancel_kind: CancelKind | null;
  cancel_reason: Generated<string>;
  cancelled_at: NullableTimestamp;
  cancelled_by: string | null;
  /** The visit scheduled in place of this canceled one. */
  rescheduled_visit_id: string | null;
}

interface ZoneChecksTable {
  id: string;
  company_id: string;
  visit_id: string;
  zone_id: string;
  status: Generated<ZoneCheckStatus>;
  quality: number | null;
  color: number | null;
  density: number | null;
  uniformity: number | null;
  bare_pct: number | null;
  weeds_pct: number | null;
  thatch_in: number | null;
  soil_moisture: SoilMoisture | null;
  soil_moisture_pct: number | null;
  height_of_cut_in: number | null;
  /** Mowed at this visit (true), explicitly not mowed today (false), or not recorded (null). */
  mowed_today: boolean | null;
  /** Grass height before mowing, when mowed at this visit (the one-third rule reads it). */
  height_before_mowing_in: number | null;
  mowing_direction: MowingDirection | null;
  is_matted: Generated<boolean>;
  is_scalped: Generated<boolean>;
  has_torn_tips: Generated<boolean>;
  has_clumped_clippings: Generated<boolean>;
  symptoms: ColumnType<ObservedSymptom[], string, string>;
  notes: Generated<string>;
  skip_reason: SkipReason | null;
  skip_note: Generated<string>;
  version: Generated<number>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
  updated_by: string | null;
  sward_index: number | null;
  index_parts: ColumnType<Record<string, number> | null, string | null, string | null>;
}

export interface AuditEventsTable {
  id: Generated<string>;
  company_id: string;
  actor_id: string | null;
  entity:
    | "visit"
    | "zone_check"
    | "property"
    | "zone"
    | "rule_set"
    | "application"
    | "photo"
    | "watering"
    | "person"
    | "soil_test"
    | "program"
    | "company";
  entity_id: string;
  action: string;
  changes: ColumnType<Record<string, { from: unknown; to: unknown }>, string, string>;
  /** The visit the event belongs to (its trail), when it belongs to one. */
  visit_id: string | null;
  /** The zone the event is about, when it is about one. */
  zone_id: string | null;
  /** Why: required for every correction of a finished visit (1–500 characters). */
  reason: string | null;
  created_at: Generated<Date>;
}

interface PhotosTable {
  id: Generated<string>;
  company_id: string;
  visit_id: string;
  zone_check_id: string;
  zone_id: string;
  property_id: string;
  content_hash: string;
  original_format: "jpeg" | "png" | "webp";
  original_bytes: number;
  width: number;
  height: number;
  display_key: string;
  display_width: number;
  display_height: number;
  thumb_key: string;
  /** Green canopy cover, % of the frame (lib/photo-analysis/color.ts). */
  green_cover_pct: number;
  /** Mean DGCI over the canopy pixels; null when there are none. */
  dgci: number | null;
  /** The method the figures came from: rows before 2026-12-02 await `npm run db:remeasure-photos`. */
  measured_by: "hue-window-2001" | "canopy-rule-2015";
  /** Share of pixels too dark to read, % (the lighting caution). */
  dark_pct: number;
  /** Share of pixels with a clipped channel, % (the lighting caution). */
  clipped_pct: number;
  /** Capture time as the camera recorded it (local, no zone), e.g. "2026-06-14 09:31:05". */
  captured_local: string | null;
  gps_latitude: number | null;
  gps_longitude: number | null;
  uploaded_by: string | null;
  created_at: Generated<Date>;
}

interface WateringsTable {
  id: string;
  company_id: string;
  property_id: string;
  zone_id: string | null;
  watered_on: ColumnType<string, string, string>;
  depth_in: number;
  run_minutes: number | null;
  precipitation_rate_in_per_h: number | null;
  entered_by_role: Role;
  notes: Generated<string>;
  /** The visit it was recorded on, when it was recorded on one. */
  visit_id: string | null;
  created_by: string | null;
  created_at: Generated<Date>;
}

type ProgramMethod = "granular" | "liquid";
export type ProgramRoundKind =
  | "feeding"
  | "pre_emergence"
  | "grub_control"
  | "weed_control"
  | "aeration_overseeding"
  | "lime"
  | "soil_sampling"
  | "fall_feeding";
type ProgramWindowKind = "dates" | "gdd" | "soil_temperature" | "air_temperature";
export type ProgramTarget = "lb" | "growth_potential" | "none";

interface ProgramsTable {
  id: string;
  company_id: string;
  name: string;
  grass_season: "cool" | "warm";
  notes: Generated<string>;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

interface ProgramRoundsTable {
  id: string;
  company_id: string;
  program_id: string;
  /** 1, 2, … in the season's order. */
  position: number;
  kind: ProgramRoundKind;
  window_kind: ProgramWindowKind;
  /** MM-DD, every year (window_kind "dates"). */
  start_md: string | null;
  end_md: string | null;
  /** Base of the growing degree days, °F (window_kind "gdd"). */
  trigger_base_f: number | null;
  /** GDD (°F·days) or a temperature (°F) that opens the window. */
  trigger_value: number | null;
  /** Days the window stays open after its trigger. */
  window_days: number | null;
  granular_product_id: string | null;
  granular_target: ProgramTarget;
  granular_n_lb: number | null;
  liquid_product_id: string | null;
  liquid_target: ProgramTarget;
  liquid_n_lb: number | null;
}

interface SoilTestsTable {
  id: string;
  company_id: string;
  property_id: string;
  /** One zone's sample, or null for the whole property. */
  zone_id: string | null;
  sampled_on: ColumnType<string, string, string>;
  lab: string;
  depth_in: number;
  extractant: "mehlich3" | "bray1" | "olsen" | "ammonium_acetate" | "other";
  ph: number | null;
  buffer_ph: number | null;
  buffer_method: "mehlich" | "smp" | "sikora" | "adams_evans" | "other" | null;
  organic_matter_pct: number | null;
  p_ppm: number | null;
  k_ppm: number | null;
  ca_ppm: number | null;
  mg_ppm: number | null;
  s_ppm: number | null;
  lab_lime_lb_per_1000: number | null;
  /** The lab report's own word on phosphorus (needed or not), when it gives one. */
  lab_p_needed: boolean | null;
  notes: Generated<string>;
  recorded_by: string | null;
  created_at: Generated<Date>;
}

interface WeatherDaysTable {
  cell: string;
  day: ColumnType<string, string, string>;
  tmax_c: number;
  tmin_c: number;
  rh_max_pct: number | null;
  rh_min_pct: number | null;
  rh_mean_pct: number | null;
  wind_ms: number | null;
  wind_height_m: number | null;
  sunshine_h: number | null;
  solar_mj: number | null;
  precip_mm: Generated<number>;
  is_forecast: Generated<boolean>;
  fetched_at: Generated<Date>;
  /** The day's hours as the service gave them (local time): { time: "HH:MM"[], tempC, rhPct }. */
  hourly: ColumnType<
    { time: string[]; tempC: number[]; rhPct: number[] } | null,
    string | null | undefined,
    string | null
  >;
  /** The service's own daily FAO-56 reference ET, mm (an outside check of ours). */
  service_et0_mm: number | null;
}

export type AlertStatus = "open" | "acknowledged" | "resolved";
export type AlertSeverity = "low" | "moderate" | "high";
type AlertEventAction =
  | "raised"
  | "reopened"
  | "updated"
  | "acknowledged"
  | "resolved"
  | "auto_resolved"
  | "cleared"
  | "returned";

/** Pressure areas the managers' digest has named (lib/risk-alerts/digest.ts): each key once. */
interface PressureAreaNoticesTable {
  company_id: string;
  area_key: string;
  kind: string;
  noticed_on: ColumnType<string, string, string>;
  created_at: Generated<Date>;
}

interface RiskAlertsTable {
  id: Generated<string>;
  company_id: string;
  property_id: string;
  zone_id: string | null;
  kind: string;
  status: ColumnType<AlertStatus, AlertStatus | undefined, AlertStatus>;
  severity: AlertSeverity;
  summary: string;
  evidence: ColumnType<unknown, string, string>;
  source: string;
  raised_on: ColumnType<string, string, string>;
  last_seen_on: ColumnType<string, string, string>;
  clear_since: ColumnType<string | null, string | null | undefined, string | null>;
  raised_by_visit_id: string | null;
  previous_alert_id: string | null;
  acknowledged_at: NullableTimestamp;
  acknowledged_by: string | null;
  resolved_at: NullableTimestamp;
  resolved_by: string | null;
  resolution: "manual" | "auto" | null;
  notified_at: NullableTimestamp;
  created_at: Generated<Date>;
  updated_at: Generated<Date>;
}

interface RiskAlertEventsTable {
  id: Generated<string>;
  alert_id: string;
  company_id: string;
  at: Generated<Date>;
  actor_id: string | null;
  action: AlertEventAction;
  from_status: AlertStatus | null;
  to_status: AlertStatus | null;
  note: Generated<string>;
  details: ColumnType<unknown, string | undefined, string>;
}

export interface PropertySummariesTable {
  property_id: string;
  company_id: string;
  latest_index: number | null;
  latest_index_on: ColumnType<string | null, string | null | undefined, string | null>;
  trend_slope: number | null;
  trend_r2: number | null;
  trend_n: number;
  trend_word: "improving" | "steady" | "declining" | null;
  last_visit_on: ColumnType<string | null, string | null | undefined, string | null>;
  next_visit_on: ColumnType<string | null, string | null | undefined, string | null>;
  missed_visit_on: ColumnType<string | null, string | null | undefined, string | null>;
  is_overdue: boolean;
  alerts_high: number;
  alerts_moderate: number;
  alerts_low: number;
  alert_kinds: ColumnType<string[], string[] | undefined, string[]>;
  n_ytd_lb: number;
  n_max_lb: number | null;
  attention_score: number;
  attention_reasons: ColumnType<string[], string[] | undefined, string[]>;
  zones_total: Generated<number>;
  zones_enough_checks: Generated<number>;
  zones_responding_n: Generated<number>;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

interface MailOutboxTable {
  id: Generated<string>;
  company_id: string;
  kind: string;
  dedupe_key: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string;
  status: ColumnType<"pending" | "sent", "pending" | "sent" | undefined, "pending" | "sent">;
  attempts: Generated<number>;
  last_error: string | null;
  /** Not tried again before this moment (back-off after a failure). */
  next_attempt_at: Generated<Date>;
  created_at: Generated<Date>;
  sent_at: NullableTimestamp;
}

export interface Database {
  companies: CompaniesTable;
  users: UsersTable;
  memberships: MembershipsTable;
  auth_accounts: AuthAccountsTable;
  auth_sessions: AuthSessionsTable;
  verification_tokens: VerificationTokensTable;
  sign_in_attempts: SignInAttemptsTable;
  sign_in_link_requests: SignInLinkRequestsTable;
  properties: PropertiesTable;
  property_homeowners: PropertyHomeownersTable;
  homeowner_invitations: HomeownerInvitationsTable;
  zones: ZonesTable;
  rule_sets: RuleSetsTable;
  visits: VisitsTable;
  zone_checks: ZoneChecksTable;
  audit_events: AuditEventsTable;
  photos: PhotosTable;
  products: ProductsTable;
  applications: ApplicationsTable;
  waterings: WateringsTable;
  soil_tests: SoilTestsTable;
  programs: ProgramsTable;
  program_rounds: ProgramRoundsTable;
  weather_days: WeatherDaysTable;
  risk_alerts: RiskAlertsTable;
  risk_alert_events: RiskAlertEventsTable;
  property_summaries: PropertySummariesTable;
  mail_outbox: MailOutboxTable;
  pressure_area_notices: PressureAreaNoticesTable;
}

export type Property = Selectable<PropertiesTable>;
export type Zone = Selectable<ZonesTable>;
export type RuleSet = Selectable<RuleSetsTable>;
export type Visit = Selectable<VisitsTable>;
export type ZoneCheck = Selectable<ZoneChecksTable>;
export type NewZoneCheck = Insertable<ZoneChecksTable>;
export type Photo = Selectable<PhotosTable>;
export type Product = Selectable<ProductsTable>;
export type WeatherDay = Selectable<WeatherDaysTable>;
