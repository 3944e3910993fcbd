"use client";

// Manager controls on a property page: zones (add, edit, archive), homeowners (invite, send again,
// withdraw an invitation; unlink) and archiving the property. Each change goes through the JSON API and refreshes the page.
import {
  Archive,
  ArchiveRestore,
  Clock,
  History,
  Mail,
  PencilLine,
  Plus,
  Send,
  UserMinus,
  UserPlus,
  X,
} from "lucide-react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button, buttonClass } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { formatDateTime } from "@/lib/dates";
import type { InvitationDto } from "@/lib/invitations/dto";
import { INVITATION_DAYS } from "@/lib/invitations/rules";
import { invitationSchema } from "@/lib/invitations/schemas";
import type { PropertyDetailDto, ZoneDto } from "@/lib/properties/dto";
import { sendJson } from "@/lib/query-client";

import { ZoneEditor } from "./zone-editor";

export function ZoneActions({
  propertyId,
  zone,
  canManage,
}: {
  propertyId: string;
  zone: ZoneDto;
  canManage: boolean;
}) {
  const router = useRouter();
  const [isEditing, setIsEditing] = useState(false);
  const [message, setMessage] = useState<string | null>(null);
  if (isEditing)
    return <ZoneEditor propertyId={propertyId} zone={zone} onDone={() => setIsEditing(false)} />;
  async function archive() {
    if (!window.confirm(`Archive ${zone.name}? Its past checks stay in the history.`)) return;
    const result = await sendJson("POST", `/api/v1/zones/${zone.id}/archive`, { archived: true });
    if (result.ok) router.refresh();
    else setMessage(result.error.message);
  }
  return (
    <div className="mt-3 flex flex-wrap gap-2">
      <Link
        href={`/properties/${propertyId}/zones/${zone.id}`}
        className={buttonClass("secondary", "no-underline")}
      >
        <History className="size-5" aria-hidden="true" />
        History
      </Link>
      {canManage ? (
        <>
          <Button
            type="button"
            variant="secondary"
            onClick={() => setIsEditing(true)}
            aria-label={`Edit ${zone.name}`}
          >
            <PencilLine className="size-5" aria-hidden="true" />
            Edit
          </Button>
          <Button
            type="button"
            variant="quiet"
            onClick={archive}
            aria-label={`Archive ${zone.name}`}
          >
            <Archive className="size-5" aria-hidden="true" />
            Archive
          </Button>
        </>
      ) : null}
      {message ? (
        <p role="alert" className="w-full text-clay">
          {message}
        </p>
      ) : null}
    </div>
  );
}

export function AddZone({ propertyId }: { propertyId: string }) {
  const [isOpen, setIsOpen] = useState(false);
  return isOpen ? (
    <ZoneEditor propertyId={propertyId} onDone={() => setIsOpen(false)} />
  ) : (
    <Button type="button" variant="secondary" onClick={() => setIsOpen(true)}>
      <Plus className="size-5" aria-hidden="true" />
      Add a zone
    </Button>
  );
}

export function HomeownerAdmin({
  property,
  invitations,
}: {
  property: PropertyDetailDto;
  invitations: InvitationDto[];
}) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof invitationSchema>, unknown, z.output<typeof invitationSchema>>({
    resolver: formResolver(invitationSchema),
    defaultValues: { name: "", email: "" },
  });
  const base = `/api/v1/properties/${property.id}`;

  async function invite(values: z.output<typeof invitationSchema>) {
    setMessage(null);
    setNotice(null);
    const result = await sendJson("POST", `${base}/invitations`, values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.message);
    }
    reset();
    setNotice(
      `Invitation sent to ${values.email}. The property is linked when they open the e-mail and accept.`,
    );
    router.refresh();
  }

  async function resend(invitation: InvitationDto) {
    setMessage(null);
    const result = await sendJson("POST", `${base}/invitations/${invitation.id}/resend`);
    if (!result.ok) return setMessage(result.error.message);
    setNotice(`A new link was sent to ${invitation.email}; the earlier one no longer works.`);
    router.refresh();
  }

  async function revoke(invitation: InvitationDto) {
    if (!window.confirm(`Withdraw the invitation to ${invitation.email}? Its link stops working.`))
      return;
    setMessage(null);
    const result = await sendJson("DELETE", `${base}/invitations/${invitation.id}`);
    if (!result.ok) return setMessage(result.error.message);
    setNotice(`The invitation to ${invitation.email} was withdrawn.`);
    router.refresh();
  }

  async function unlink(userId: string, who: string) {
    if (!window.confirm(`Unlink ${who}? They will no longer see this property.`)) return;
    const result = await sendJson("DELETE", `${base}/homeowners/${userId}`);
    if (result.ok) router.refresh();
    else setMessage(result.error.message);
  }

  return (
    <div className="space-y-3">
      {property.homeowners.length === 0 ? (
        <p className="text-muted">No homeowner follows this property yet.</p>
      ) : null}
      <ul className="space-y-2" aria-label="Linked homeowners">
        {property.homeowners.map((h) => (
          <li
            key={h.id}
            className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
          >
            <span>
              <span className="font-semibold">{h.name}</span>{" "}
              <span className="text-muted">{h.email}</span>
            </span>
            <Button
              type="button"
              variant="quiet"
              onClick={() => unlink(h.id, h.name)}
              aria-label={`Unlink ${h.name}`}
            >
              <UserMinus className="size-5" aria-hidden="true" />
              Unlink
            </Button>
          </li>
        ))}
      </ul>
      {invitations.length ? (
        <section aria-labelledby="invitations-title" className="space-y-2">
          <h3 id="invitations-title" className="text-lg font-bold">
            Pending invitations
          </h3>
          <ul className="space-y-2">
            {invitations.map((i) => (
              <li
                key={i.id}
                className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
              >
                <span>
                  <span className="font-semibold">{i.name}</span>{" "}
                  <span className="text-muted">{i.email}</span>
                  <span className="block text-sm">
                    {i.isExpired ? (
                      <span className="inline-flex items-center gap-1 font-semibold text-clay">
                        <Clock className="size-4" aria-hidden="true" />
                        Link expired {formatDateTime(i.expiresAt, property.timeZone)}
                      </span>
                    ) : (
                      <span className="inline-flex items-center gap-1 text-muted">
                        <Mail className="size-4" aria-hidden="true" />
                        Sent {formatDateTime(i.sentAt, property.timeZone)}
                        {i.sendCount > 1 ? ` (${i.sendCount} times)` : ""} · link works until{" "}
                        {formatDateTime(i.expiresAt, property.timeZone)}
                      </span>
                    )}
                  </span>
                </span>
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
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      <form
        onSubmit={handleSubmit(invite)}
        className="grid gap-3 rounded-xl border border-line bg-card p-4 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
        noValidate
        aria-label="Invite a homeowner"
      >
        <Field id="homeowner-name" label="Homeowner name" error={errors.name?.message}>
          <input
            id="homeowner-name"
            {...register("name")}
            aria-invalid={errors.name ? true : undefined}
            className={inputClass}
          />
        </Field>
        <Field id="homeowner-email" label="E-mail" error={errors.email?.message}>
          <input
            id="homeowner-email"
            type="email"
            inputMode="email"
            {...register("email")}
            aria-invalid={errors.email ? true : undefined}
            className={inputClass}
          />
        </Field>
        <Button type="submit" disabled={isSubmitting}>
          <UserPlus className="size-5" aria-hidden="true" />
          Invite
        </Button>
        <p className="text-sm text-muted sm:col-span-3">
          We e-mail them a link that works for {INVITATION_DAYS} days. They see this property once
          they accept.
        </p>
        {notice ? (
          <p role="status" className="text-sward sm:col-span-3">
            {notice}
          </p>
        ) : null}
        {message ? (
          <p role="alert" className="text-clay sm:col-span-3">
            {message}
          </p>
        ) : null}
      </form>
    </div>
  );
}

export function ArchiveProperty({ property }: { property: PropertyDetailDto }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  async function toggle() {
    const archived = !property.isArchived;
    if (
      archived &&
      !window.confirm(
        `Archive ${property.name}? It leaves the book; its visits and history are kept.`,
      )
    )
      return;
    const result = await sendJson("POST", `/api/v1/properties/${property.id}/archive`, {
      archived,
    });
    if (result.ok) router.refresh();
    else setMessage(result.error.message);
  }
  return (
    <>
      <Button type="button" variant="secondary" onClick={toggle}>
        {property.isArchived ? (
          <ArchiveRestore className="size-5" aria-hidden="true" />
        ) : (
          <Archive className="size-5" aria-hidden="true" />
        )}
        {property.isArchived ? "Restore property" : "Archive property"}
      </Button>
      {message ? (
        <p role="alert" className="text-clay">
          {message}
        </p>
      ) : null}
    </>
  );
}
