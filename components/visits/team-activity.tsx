// Each technician's last eight weeks: visits finished per week, checks per visit, photos per check.
import type { TechnicianActivity } from "@/lib/book/team";
import { formatDate } from "@/lib/dates";

export function TeamActivity({ technicians }: { technicians: TechnicianActivity[] }) {
  if (!technicians.length)
    return <p className="rounded-lg border border-line bg-card p-4">No technicians yet.</p>;
  const weeks = technicians[0]!.weeks.map((w) => w.weekStart);
  return (
    <div
      className="overflow-x-auto rounded-xl border border-line bg-card"
      role="region"
      aria-label="Technicians' last eight weeks (scrolls sideways)"
      tabIndex={0}
    >
      <table className="w-full min-w-[48rem] text-left text-sm">
        <caption className="sr-only">
          Visits finished per week, checks per visit and photos per check, by technician
        </caption>
        <thead className="border-b border-line bg-paper">
          <tr>
            <th scope="col" className="p-2">
              Technician
            </th>
            {weeks.map((w) => (
              <th key={w} scope="col" className="p-2 text-right">
                <span className="sr-only">Week of </span>
                {formatDate(w)
                  .replace(/^\w+, /, "")
                  .replace(/ \d{4}$/, "")}
              </th>
            ))}
            <th scope="col" className="p-2 text-right">
              Checks per visit
            </th>
            <th scope="col" className="p-2 text-right">
              Photos per check
            </th>
          </tr>
        </thead>
        <tbody>
          {technicians.map((t) => (
            <tr key={t.technicianId} className="border-b border-line last:border-0">
              <th scope="row" className="p-2 font-semibold">
                {t.name}
                <span className="block text-xs font-normal text-muted">
                  {t.visits} visits in 8 weeks
                </span>
              </th>
              {t.weeks.map((w) => (
                <td
                  key={w.weekStart}
                  className={`p-2 text-right ${w.visits ? "font-bold" : "text-muted"}`}
                >
                  {w.visits}
                </td>
              ))}
              <td className="p-2 text-right">
                {t.checksPerVisit === null ? "—" : t.checksPerVisit.toFixed(1)}
              </td>
              <td className="p-2 text-right">
                {t.photosPerCheck === null ? "—" : t.photosPerCheck.toFixed(1)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
