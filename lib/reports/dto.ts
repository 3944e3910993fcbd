// A visit report as its readers see it (lib/reports/queries.ts).
import type { PlannedService } from "@/db/schema";
import type { PhotoDto } from "@/lib/photos/dto";

import type { MatchedNote } from "./care-notes";

export interface VisitReport {
  visitId: string;
  date: string;
  propertyId: string;
  propertyName: string;
  address: string;
  companyName: string;
  technicianName: string | null;
  weather: { tmaxF: number; tminF: number; precipIn: number } | null;
  propertyIndex: number | null;
  zones: {
    zoneId: string;
    name: string;
    skipped: string | null;
    sentences: string[];
    index: number | null;
    photos: PhotoDto[];
  }[];
  applications: {
    zoneName: string;
    productName: string;
    isPesticide: boolean;
    registrationNumber: string;
    nLb: number;
    p2o5Lb: number;
    k2oLb: number;
    labelCautions: string;
    reentryGuidance: string;
  }[];
  careNotes: MatchedNote[];
  /** The property's next scheduled visit after this one (its day and planned service), if any. */
  nextVisit: NextVisit | null;
}

export interface NextVisit {
  date: string;
  service: PlannedService;
}
