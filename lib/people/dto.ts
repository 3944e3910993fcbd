// A person of the company, as staff screens show them.
import type { Role } from "@/db/schema";

export interface PersonDto {
  id: string;
  name: string;
  email: string;
  role: Role;
  isDisabled: boolean;
}

/** A technician's applicator license on record, with its standing on the company's today. */
export interface LicenseDto {
  number: string;
  category: string;
  /** The last day it is good (YYYY-MM-DD). */
  expiresOn: string;
  standing: "valid" | "expiring" | "expired";
  /** Whole days until the expiry (negative once expired). */
  daysLeft: number;
}

/** One person on the People page. */
export interface DirectoryPersonDto {
  id: string;
  name: string;
  email: string;
  role: Role;
  isDisabled: boolean;
  isYou: boolean;
  /** Technicians: their license, or null when none is on record. */
  license: LicenseDto | null;
  /** Technicians: the properties they are assigned; homeowners: their properties. */
  properties: { id: string; name: string; street: string }[];
  /** Technicians: their own start point (takes the yard's place on their Today), or null. */
  startPoint: StartPointDto | null;
}

/** Where a technician's day starts and ends, when not at the company's yard. */
interface StartPointDto {
  address: string;
  latitude: number;
  longitude: number;
}

/** A pending invitation on the People page (staff, or a homeowner to a property). */
export interface DirectoryInvitationDto {
  id: string;
  email: string;
  name: string;
  role: Role;
  property: { id: string; name: string } | null;
  sentAt: string;
  expiresAt: string;
  isExpired: boolean;
  sendCount: number;
}

export interface PeopleDirectoryDto {
  /** The company's today (YYYY-MM-DD) and time zone, for the license warnings and expiry times. */
  today: string;
  timeZone: string;
  people: DirectoryPersonDto[];
  invitations: DirectoryInvitationDto[];
}

/** What a reassignment moves (the count shown before confirming, and the result). */
export interface ReassignCountDto {
  properties: number;
  stops: number;
}
