// A technician's own applicator license warning on Today: shown from 30 days before the expiry,
// and once it has expired (pesticide applications are then refused). Nothing when it is good.
import { AlertTriangle } from "lucide-react";

import type { Actor } from "@/lib/auth/actor";
import { formatDate } from "@/lib/dates";
import { getOwnLicense } from "@/lib/people/queries";

export async function LicenseNotice({ actor }: { actor: Actor }) {
  const license = await getOwnLicense(actor);
  if (!license || license.standing === "valid") return null;
  const on = formatDate(license.expiresOn, actor.companyLocale);
  return (
    <div
      role="status"
      className="mt-3 flex gap-3 rounded-xl border border-sun bg-sun-tint p-4 text-ink"
      aria-label="Your applicator license"
    >
      <AlertTriangle className="mt-0.5 size-5 shrink-0 text-sun" aria-hidden="true" />
      <p>
        {license.standing === "expired" ? (
          <>
            Your applicator license {license.number} expired on {on}. Pesticide applications cannot
            be recorded until it is renewed and your manager updates it.
          </>
        ) : (
          <>
            Your applicator license {license.number} expires on {on} (
            {license.daysLeft === 0
              ? "today"
              : `in ${license.daysLeft} ${license.daysLeft === 1 ? "day" : "days"}`}
            ). Renew it with your state and tell your manager the new expiry.
          </>
        )}
      </p>
    </div>
  );
}
