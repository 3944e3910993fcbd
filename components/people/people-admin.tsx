"use client";

// The People page's controls (managers): invite a technician or a manager, send an invitation
// again or withdraw it, change a staff role, disable or re-enable an account, keep each
// technician's applicator license, and move one technician's properties to another. Each change
// goes through the JSON API and refreshes the page.
import {
  AlertTriangle,
  ArrowRightLeft,
  BadgeCheck,
  Ban,
  Clock,
  Mail,
  MapPin,
  PencilLine,
  RotateCcw,
  Send,
  UserPlus,
  X,
} from "lucide-react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { formatDate, formatDateTime } from "@/lib/dates";
import { INVITATION_DAYS } from "@/lib/invitations/rules";
import { staffInvitationSchema } from "@/lib/invitations/schemas";
import type {
  DirectoryInvitationDto,
  DirectoryPersonDto,
  PeopleDirectoryDto,
  ReassignCountDto,
} from "@/lib/people/dto";
import { LICENSE_WARNING_DAYS } from "@/lib/people/license";
import { fetchJson, HttpError, sendJson } from "@/lib/query-client";

const ROLE_WORDS = { manager: "Manager", technician: "Technician", homeowner: "Homeowner" };

export function PeopleAdmin({
  directory,
  locale,
}: {
  directory: PeopleDirectoryDto;
  locale: string;
}) {
  const managers = directory.people.filter((p) => p.role === "manager");
  const technicians = directory.people.filter((p) => p.role === "technician");
  const homeowners = directory.people.filter((p) => p.role === "homeowner");
  const expiring = technicians.filter(
    (t) => t.license && t.license.standing !== "valid" && !t.isDisabled,
  );
  return (
    <div className="space-y-10">
      {expiring.length ? (
        <div
          role="status"
          className="flex gap-3 rounded-xl border border-sun bg-sun-tint p-4 text-ink"
          aria-label="Applicator licenses to renew"
        >
          <AlertTriangle className="mt-0.5 size-5 shrink-0 text-sun" aria-hidden="true" />
          <ul className="space-y-1">
            {expiring.map((t) => (
              <li key={t.id}>
                <strong>{t.name}</strong>: <LicenseWords person={t} locale={locale} />
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      <InviteStaff />
      <Invitations directory={directory} locale={locale} />
      <PeopleSection title="Managers" people={managers} directory={directory} locale={locale} />
      <PeopleSection
        title="Technicians"
        people={technicians}
        directory={directory}
        locale={locale}
      />
      <Reassign technicians={technicians} />
      <PeopleSection title="Homeowners" people={homeowners} directory={directory} locale={locale} />
    </div>
  );
}

function LicenseWords({
  person,
  locale,
  capital = false,
}: {
  person: DirectoryPersonDto;
  locale: string;
  capital?: boolean;
}) {
  const license = person.license;
  if (!license) return <>{capital ? "No" : "no"} applicator license on record</>;
  const on = formatDate(license.expiresOn, locale);
  const what = `${capital ? "Applicator" : "applicator"} license ${license.number}`;
  if (license.standing === "expired")
    return (
      <>
        {what} expired on {on}; pesticide applications are refused until it is renewed
      </>
    );
  if (license.standing === "expiring")
    return (
      <>
        {what} expires on {on} (
        {license.daysLeft === 0
          ? "today"
          : `in ${license.daysLeft} ${license.daysLeft === 1 ? "day" : "days"}`}
        )
      </>
    );
  return (
    <>
      {what} good through {on}
    </>
  );
}

function InviteStaff() {
  const router = useRouter();
  const [notice, setNotice] = useState<string | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<
    z.input<typeof staffInvitationSchema>,
    unknown,
    z.output<typeof staffInvitationSchema>
  >({
    resolver: formResolver(staffInvitationSchema),
    defaultValues: { name: "", email: "", role: "technician" },
  });

  async function invite(values: z.output<typeof staffInvitationSchema>) {
    setMessage(null);
    setNotice(null);
    const result = await sendJson("POST", "/api/v1/people/invitations", values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError);
      setMessage(result.error.message);
      return;
    }
    reset({ name: "", email: "", role: values.role });
    setNotice(
      `Invitation sent to ${values.email}. They set a password from the e-mailed link and can then sign in.`,
    );
    router.refresh();
  }

  return (
    <section aria-labelledby="invite-title" className="space-y-3">
      <h2 id="invite-title" className="text-xl font-bold">
        Invite a technician or a manager
      </h2>
      <form
        onSubmit={handleSubmit(invite)}
        className="grid gap-3 rounded-xl border border-line bg-card p-4 md:grid-cols-[1fr_1fr_12rem_auto] md:items-end"
        noValidate
        aria-label="Invite a technician or a manager"
      >
        <Field id="staff-name" label="Name" error={errors.name?.message}>
          <input
            id="staff-name"
            autoComplete="off"
            {...register("name")}
            aria-invalid={errors.name ? true : undefined}
            className={inputClass}
          />
        </Field>
        <Field id="staff-email" label="E-mail" error={errors.email?.message}>
          <input
            id="staff-email"
            type="email"
            inputMode="email"
            autoComplete="off"
            {...register("email")}
            aria-invalid={errors.email ? true : undefined}
            className={inputClass}
          />
        </Field>
        <Field id="staff-role" label="Role" error={errors.role?.message}>
          <select id="staff-role" {...register("role")} className={inputClass}>
            <option value="technician">Technician</option>
            <option value="manager">Manager</option>
          </select>
        </Field>
        <Button type="submit" disabled={isSubmitting}>
          <UserPlus className="size-5" aria-hidden="true" />
          Invite
        </Button>
        <p className="text-sm text-muted md:col-span-4">
          We e-mail them a link that works once, for {INVITATION_DAYS} days. Homeowners are invited
          from their property&rsquo;s page.
        </p>
        {notice ? (
          <p role="status" className="text-sward md:col-span-4">
            {notice}
          </p>
        ) : null}
        {message ? (
          <p role="alert" className="font-semibold text-clay md:col-span-4">
            {message}
          </p>
        ) : null}
      </form>
    </section>
  );
}

function Invitations({ directory, locale }: { directory: PeopleDirectoryDto; locale: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  if (!directory.invitations.length) return null;

  async function resend(i: DirectoryInvitationDto) {
    setMessage(null);
    const result = await sendJson("POST", `/api/v1/people/invitations/${i.id}/resend`);
    if (!result.ok) return setMessage(result.error.message);
    setNotice(`A new link was sent to ${i.email}; the earlier one no longer works.`);
    router.refresh();
  }
  async function revoke(i: DirectoryInvitationDto) {
    if (!window.confirm(`Withdraw the invitation to ${i.email}? Its link stops working.`)) return;
    setMessage(null);
    const result = await sendJson("DELETE", `/api/v1/people/invitations/${i.id}`);
    if (!result.ok) return setMessage(result.error.message);
    setNotice(`The invitation to ${i.email} was withdrawn.`);
    router.refresh();
  }

  return (
    <section aria-labelledby="invitations-title" className="space-y-3">
      <h2 id="invitations-title" className="text-xl font-bold">
        Invited
      </h2>
      {notice ? (
        <p role="status" className="text-sward">
          {notice}
        </p>
      ) : null}
      {message ? (
        <p role="alert" className="font-semibold text-clay">
          {message}
        </p>
      ) : null}
      <ul className="space-y-2">
        {directory.invitations.map((i) => (
          <li
            key={i.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
          >
            <span>
              <span className="font-semibold">{i.name}</span>{" "}
              <span className="break-all text-muted">{i.email}</span>
              <span className="block text-sm">
                {ROLE_WORDS[i.role]}
                {i.property ? (
                  <>
                    {" of "}
                    <Link href={`/properties/${i.property.id}`} className="text-sward underline">
                      {i.property.name}
                    </Link>
                  </>
                ) : null}
                {" · "}
                {i.isExpired ? (
                  <span className="inline-flex items-center gap-1 font-semibold text-clay">
                    <Clock className="size-4" aria-hidden="true" />
                    Invited — link expired {formatDateTime(i.expiresAt, directory.timeZone, locale)}
                  </span>
                ) : (
                  <span className="inline-flex items-center gap-1 text-muted">
                    <Mail className="size-4" aria-hidden="true" />
                    Invited — link works until{" "}
                    {formatDateTime(i.expiresAt, directory.timeZone, locale)}
                    {i.sendCount > 1 ? ` (sent ${i.sendCount} times)` : ""}
                  </span>
                )}
              </span>
            </span>
            {i.property ? null : (
              <span className="flex flex-wrap gap-2">
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => resend(i)}
                  aria-label={`Send the invitation to ${i.email} again`}
                >
                  <Send className="size-5" aria-hidden="true" />
                  Send again
                </Button>
                <Button
                  type="button"
                  variant="quiet"
                  onClick={() => revoke(i)}
                  aria-label={`Withdraw the invitation to ${i.email}`}
                >
                  <X className="size-5" aria-hidden="true" />
                  Withdraw
                </Button>
              </span>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}

function PeopleSection({
  title,
  people,
  directory,
  locale,
}: {
  title: string;
  people: DirectoryPersonDto[];
  directory: PeopleDirectoryDto;
  locale: string;
}) {
  const id = `people-${title.toLowerCase()}`;
  return (
    <section aria-labelledby={id} className="space-y-3">
      <h2 id={id} className="text-xl font-bold">
        {title} <span className="text-base font-normal text-muted">({people.length})</span>
      </h2>
      {people.length ? (
        <ul className="space-y-2">
          {people.map((p) => (
            <PersonRow key={p.id} person={p} directory={directory} locale={locale} />
          ))}
        </ul>
      ) : (
        <p className="text-muted">Nobody yet.</p>
      )}
    </section>
  );
}

function PersonRow({
  person,
  directory,
  locale,
}: {
  person: DirectoryPersonDto;
  directory: PeopleDirectoryDto;
  locale: string;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [isEditingLicense, setIsEditingLicense] = useState(false);
  const [isEditingStart, setIsEditingStart] = useState(false);

  async function change(body: { role?: "manager" | "technician"; disabled?: boolean }) {
    setMessage(null);
    if (
      body.disabled &&
      !window.confirm(`Disable ${person.name}? They are signed out at once and cannot sign in.`)
    )
      return;
    const result = await sendJson("PATCH", `/api/v1/people/${person.id}`, body);
    if (!result.ok) return setMessage(result.error.message);
    router.refresh();
  }

  return (
    <li className="rounded-lg border border-line bg-card p-3">
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <p>
            <span className="font-semibold">{person.name}</span>
            {person.isYou ? <span className="text-muted"> (you)</span> : null}{" "}
            <span className="break-all text-muted">{person.email}</span>
          </p>
          <p className="text-sm">
            {person.isDisabled ? (
              <span className="inline-flex items-center gap-1 font-semibold text-clay">
                <Ban className="size-4" aria-hidden="true" />
                Disabled
              </span>
            ) : (
              <span className="inline-flex items-center gap-1 text-sward">
                <BadgeCheck className="size-4" aria-hidden="true" />
                Active
              </span>
            )}
            {person.role !== "manager" ? (
              <span className="text-muted">
                {" · "}
                {person.properties.length}{" "}
                {person.properties.length === 1 ? "property" : "properties"}
              </span>
            ) : null}
          </p>
          {person.role === "technician" ? (
            <p
              className={
                person.license?.standing === "valid"
                  ? "text-sm text-muted"
                  : "inline-flex items-center gap-1 text-sm font-semibold text-sun"
              }
            >
              {person.license?.standing === "valid" ? null : (
                <AlertTriangle className="size-4" aria-hidden="true" />
              )}
              <span>
                <LicenseWords person={person} locale={locale} capital />
                {person.license?.category ? ` · ${person.license.category}` : ""}
              </span>
            </p>
          ) : null}
          {person.role === "technician" ? (
            <p className="inline-flex items-center gap-1 text-sm text-muted">
              <MapPin className="size-4" aria-hidden="true" />
              {person.startPoint
                ? `Day starts and ends at ${person.startPoint.address || "their start point"}`
                : "Day starts and ends at the yard"}
            </p>
          ) : null}
          {person.role === "homeowner" && person.properties.length ? (
            <p className="text-sm">
              {person.properties.map((p, n) => (
                <span key={p.id}>
                  {n ? " · " : ""}
                  <Link href={`/properties/${p.id}`} className="text-sward underline">
                    {p.name}
                  </Link>
                </span>
              ))}
            </p>
          ) : null}
        </div>
        {person.isYou ? null : (
          <div className="flex flex-wrap gap-2">
            {person.role === "technician" ? (
              <>
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => setIsEditingLicense((v) => !v)}
                  aria-label={`Applicator license of ${person.name}`}
                  aria-expanded={isEditingLicense}
                >
                  <PencilLine className="size-5" aria-hidden="true" />
                  License
                </Button>
                <Button
                  type="button"
                  variant="secondary"
                  onClick={() => setIsEditingStart((v) => !v)}
                  aria-label={`Start point of ${person.name}`}
                  aria-expanded={isEditingStart}
                >
                  <MapPin className="size-5" aria-hidden="true" />
                  Start point
                </Button>
                <Button
                  type="button"
                  variant="quiet"
                  onClick={() => change({ role: "manager" })}
                  aria-label={`Make ${person.name} a manager`}
                >
                  Make manager
                </Button>
              </>
            ) : null}
            {person.role === "manager" ? (
              <Button
                type="button"
                variant="quiet"
                onClick={() => change({ role: "technician" })}
                aria-label={`Make ${person.name} a technician`}
              >
                Make technician
              </Button>
            ) : null}
            {person.isDisabled ? (
              <Button
                type="button"
                variant="secondary"
                onClick={() => change({ disabled: false })}
                aria-label={`Re-enable ${person.name}`}
              >
                <RotateCcw className="size-5" aria-hidden="true" />
                Re-enable
              </Button>
            ) : (
              <Button
                type="button"
                variant="quiet"
                onClick={() => change({ disabled: true })}
                aria-label={`Disable ${person.name}`}
              >
                <Ban className="size-5" aria-hidden="true" />
                Disable
              </Button>
            )}
          </div>
        )}
      </div>
      {message ? (
        <p role="alert" className="mt-2 font-semibold text-clay">
          {message}
        </p>
      ) : null}
      {isEditingLicense ? (
        <LicenseForm
          person={person}
          today={directory.today}
          onDone={() => {
            setIsEditingLicense(false);
            router.refresh();
          }}
        />
      ) : null}
      {isEditingStart ? (
        <StartPointForm
          person={person}
          onDone={() => {
            setIsEditingStart(false);
            router.refresh();
          }}
        />
      ) : null}
    </li>
  );
}

/** A number typed in a coordinate field: empty is null; what does not read as a number is sent as
 * typed, so the server's message names the field. */
const coordinate = (typed: string): number | string | null => {
  const t = typed.trim();
  if (t === "") return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : t;
};

function StartPointForm({ person, onDone }: { person: DirectoryPersonDto; onDone: () => void }) {
  const [values, setValues] = useState({
    address: person.startPoint?.address ?? "",
    latitude: person.startPoint ? String(person.startPoint.latitude) : "",
    longitude: person.startPoint ? String(person.startPoint.longitude) : "",
  });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [isSaving, setIsSaving] = useState(false);
  const base = `start-${person.id}`;

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setIsSaving(true);
    setMessage(null);
    const result = await sendJson("PUT", `/api/v1/people/${person.id}/start-point`, {
      address: values.address,
      latitude: coordinate(values.latitude),
      longitude: coordinate(values.longitude),
    });
    setIsSaving(false);
    if (!result.ok) {
      setErrors(result.error.fieldErrors ?? {});
      setMessage(result.error.message);
      return;
    }
    onDone();
  }
  const field = (key: keyof typeof values) => ({
    id: `${base}-${key}`,
    value: values[key],
    onChange: (e: React.ChangeEvent<HTMLInputElement>) =>
      setValues((v) => ({ ...v, [key]: e.target.value })),
    "aria-invalid": errors[key] ? true : undefined,
    className: inputClass,
    autoComplete: "off",
  });

  return (
    <form
      onSubmit={save}
      className="mt-3 grid gap-3 border-t border-line pt-3 md:grid-cols-3"
      noValidate
      aria-label={`Start point of ${person.name}`}
    >
      <Field
        id={`${base}-address`}
        label="Address"
        hint="As the technician reads it"
        error={errors.address?.[0]}
      >
        <input {...field("address")} />
      </Field>
      <Field id={`${base}-latitude`} label="Latitude" error={errors.latitude?.[0]}>
        <input {...field("latitude")} inputMode="decimal" />
      </Field>
      <Field id={`${base}-longitude`} label="Longitude" error={errors.longitude?.[0]}>
        <input {...field("longitude")} inputMode="decimal" />
      </Field>
      <p className="text-sm text-muted md:col-span-3">
        Where this technician&rsquo;s day on Today starts and ends, when it is not the yard (a
        technician who drives from home). Decimal degrees, e.g. 40.3342 and -74.7391; clear both to
        start from the yard again.
      </p>
      {message ? (
        <p role="alert" className="font-semibold text-clay md:col-span-3">
          {message}
        </p>
      ) : null}
      <div className="flex gap-2 md:col-span-3">
        <Button type="submit" disabled={isSaving}>
          Save start point
        </Button>
      </div>
    </form>
  );
}

function LicenseForm({
  person,
  today,
  onDone,
}: {
  person: DirectoryPersonDto;
  today: string;
  onDone: () => void;
}) {
  const [values, setValues] = useState({
    number: person.license?.number ?? "",
    category: person.license?.category ?? "",
    expiresOn: person.license?.expiresOn ?? "",
  });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const [isSaving, setIsSaving] = useState(false);
  const base = `license-${person.id}`;

  async function save(event: React.FormEvent) {
    event.preventDefault();
    setIsSaving(true);
    setMessage(null);
    const result = await sendJson("PUT", `/api/v1/people/${person.id}/license`, values);
    setIsSaving(false);
    if (!result.ok) {
      setErrors(result.error.fieldErrors ?? {});
      setMessage(result.error.message);
      return;
    }
    onDone();
  }
  const field = (key: keyof typeof values) => ({
    id: `${base}-${key}`,
    value: values[key],
    onChange: (e: React.ChangeEvent<HTMLInputElement>) =>
      setValues((v) => ({ ...v, [key]: e.target.value })),
    "aria-invalid": errors[key] ? true : undefined,
    className: inputClass,
  });

  return (
    <form
      onSubmit={save}
      className="mt-3 grid gap-3 border-t border-line pt-3 md:grid-cols-3"
      noValidate
      aria-label={`Applicator license of ${person.name}`}
    >
      <Field id={`${base}-number`} label="License number" error={errors.number?.[0]}>
        <input {...field("number")} autoComplete="off" />
      </Field>
      <Field
        id={`${base}-category`}
        label="Category"
        hint="As printed on the license"
        error={errors.category?.[0]}
      >
        <input {...field("category")} autoComplete="off" />
      </Field>
      <Field
        id={`${base}-expiresOn`}
        label="Expires on"
        hint={`Warned ${LICENSE_WARNING_DAYS} days ahead`}
        error={errors.expiresOn?.[0]}
      >
        <input {...field("expiresOn")} type="date" min={person.license ? undefined : today} />
      </Field>
      <p className="text-sm text-muted md:col-span-3">
        Used on this technician&rsquo;s pesticide applications and in the records export. Follow
        your state&rsquo;s certification rules and the product label; clear all three fields to
        remove the license.
      </p>
      {message ? (
        <p role="alert" className="font-semibold text-clay md:col-span-3">
          {message}
        </p>
      ) : null}
      <div className="flex gap-2 md:col-span-3">
        <Button type="submit" disabled={isSaving}>
          Save license
        </Button>
      </div>
    </form>
  );
}

function Reassign({ technicians }: { technicians: DirectoryPersonDto[] }) {
  const router = useRouter();
  const [from, setFrom] = useState("");
  const [to, setTo] = useState("");
  const [count, setCount] = useState<ReassignCountDto | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);
  const nameOf = (id: string) => technicians.find((t) => t.id === id)?.name ?? "";
  if (technicians.length < 2) return null;

  async function preview(event: React.FormEvent) {
    event.preventDefault();
    setMessage(null);
    setNotice(null);
    setCount(null);
    if (!from || !to)
      return setMessage("Choose the technician the properties come from and the one they go to.");
    if (from === to)
      return setMessage("To: choose a different technician than the one the properties come from.");
    try {
      setCount(await fetchJson<ReassignCountDto>(`/api/v1/people/reassign?from=${from}`));
    } catch (err) {
      setMessage(err instanceof HttpError ? err.message : "The count could not be loaded.");
    }
  }
  async function confirm() {
    setIsBusy(true);
    const result = await sendJson<ReassignCountDto>("POST", "/api/v1/people/reassign", {
      fromTechnicianId: from,
      toTechnicianId: to,
    });
    setIsBusy(false);
    setCount(null);
    if (!result.ok) return setMessage(result.error.message);
    setNotice(
      `${result.data.properties} ${result.data.properties === 1 ? "property" : "properties"} and ${result.data.stops} scheduled ${result.data.stops === 1 ? "stop" : "stops"} moved to ${nameOf(to)}.`,
    );
    router.refresh();
  }

  return (
    <section aria-labelledby="reassign-title" className="space-y-3">
      <h2 id="reassign-title" className="text-xl font-bold">
        Move properties to another technician
      </h2>
      <form
        onSubmit={preview}
        className="grid gap-3 rounded-xl border border-line bg-card p-4 md:grid-cols-[1fr_1fr_auto] md:items-end"
        aria-label="Move properties to another technician"
        noValidate
      >
        <Field id="reassign-from" label="From">
          <select
            id="reassign-from"
            value={from}
            onChange={(e) => {
              setFrom(e.target.value);
              setCount(null);
            }}
            className={inputClass}
          >
            <option value="">Choose a technician</option>
            {technicians.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name} ({t.properties.length})
              </option>
            ))}
          </select>
        </Field>
        <Field id="reassign-to" label="To">
          <select
            id="reassign-to"
            value={to}
            onChange={(e) => {
              setTo(e.target.value);
              setCount(null);
            }}
            className={inputClass}
          >
            <option value="">Choose a technician</option>
            {technicians
              .filter((t) => !t.isDisabled)
              .map((t) => (
                <option key={t.id} value={t.id}>
                  {t.name}
                </option>
              ))}
          </select>
        </Field>
        <Button type="submit" variant="secondary">
          <ArrowRightLeft className="size-5" aria-hidden="true" />
          Count what moves
        </Button>
        <p className="text-sm text-muted md:col-span-3">
          Each property and its future scheduled stops move; finished visits keep who did them.
        </p>
        {count ? (
          <div className="space-y-2 md:col-span-3" role="status">
            <p>
              {count.properties} {count.properties === 1 ? "property" : "properties"} and{" "}
              {count.stops} future scheduled {count.stops === 1 ? "stop" : "stops"} move from{" "}
              {nameOf(from)} to {nameOf(to)}.
            </p>
            <Button type="button" onClick={confirm} disabled={isBusy || count.properties === 0}>
              Move them
            </Button>
          </div>
        ) : null}
        {notice ? (
          <p role="status" className="text-sward md:col-span-3">
            {notice}
          </p>
        ) : null}
        {message ? (
          <p role="alert" className="font-semibold text-clay md:col-span-3">
            {message}
          </p>
        ) : null}
      </form>
    </section>
  );
}
