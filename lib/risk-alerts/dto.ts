// Alerts as the app shows them.
import type { AlertSeverity, AlertStatus } from "@/db/schema";
import type { Evidence } from "@/lib/risk/rules";

export interface AlertDto {
  id: string;
  kind: string;
  kindLabel: string;
  severity: AlertSeverity;
  status: AlertStatus;
  summary: string;
  evidence: Evidence;
  source: string;
  raisedOn: string;
  lastSeenOn: string;
  clearSince: string | null;
  property: { id: string; name: string; city: string };
  zone: { id: string; name: string } | null;
  technicianName: string | null;
  acknowledgedAt: string | null;
  acknowledgedBy: string | null;
  resolvedAt: string | null;
  resolvedBy: string | null;
  resolution: "manual" | "auto" | null;
  previousAlertId: string | null;
  events: { at: string; action: string; actor: string | null; note: string }[];
}
