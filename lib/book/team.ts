// How each technician's work went over the last weeks (pure): visits finished per week, zone
// checks per visit, photos per check.
import { addDays, daysBetween } from "@/lib/dates";

interface TechnicianWeek {
  weekStart: string; // Monday
  visits: number;
}

export interface TechnicianActivity {
  technicianId: string;
  name: string;
  weeks: TechnicianWeek[];
  visits: number;
  checksPerVisit: number | null;
  photosPerCheck: number | null;
}

/** The Monday of a date's week. */
export function weekStart(date: string): string {
  const dow = new Date(`${date}T00:00:00Z`).getUTCDay(); // 0 Sunday
  return addDays(date, -((dow + 6) % 7));
}

export function technicianActivity(
  technicians: { id: string; name: string }[],
  visits: { technicianId: string; completedOn: string; checks: number; photos: number }[],
  today: string,
  weeks = 8,
): TechnicianActivity[] {
  const first = addDays(weekStart(today), -7 * (weeks - 1));
  const starts = Array.from({ length: weeks }, (_, i) => addDays(first, 7 * i));
  return technicians.map((t) => {
    const own = visits.filter(
      (v) => v.technicianId === t.id && v.completedOn >= first && v.completedOn <= today,
    );
    const checks = own.reduce((s, v) => s + v.checks, 0);
    const photos = own.reduce((s, v) => s + v.photos, 0);
    return {
      technicianId: t.id,
      name: t.name,
      weeks: starts.map((w) => ({
        weekStart: w,
        visits: own.filter(
          (v) => daysBetween(w, v.completedOn) >= 0 && daysBetween(w, v.completedOn) < 7,
        ).length,
      })),
      visits: own.length,
      checksPerVisit: own.length ? checks / own.length : null,
      photosPerCheck: checks ? photos / checks : null,
    };
  });
}
