"use client";

// Manager controls on a property page: zones (add, edit, archive), homeowner sign-ins (link,
// unlink) and archiving the property. Each change goes through the JSON API and refreshes the page.
import {
  Archive,
  ArchiveRestore,
  History,
  PencilLine,
  Plus,
  UserMinus,
  UserPlus,
} from "lucide-react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button, buttonClass } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import type { PropertyDetailDto, ZoneDto } from "@/lib/properties/dto";
import { homeownerLinkSchema } from "@/lib/properties/schemas";
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

export function HomeownerAdmin({ property }: { property: PropertyDetailDto }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof homeownerLinkSchema>, unknown, z.output<typeof homeownerLinkSchema>>({
    resolver: formResolver(homeownerLinkSchema),
    defaultValues: { name: "", email: "" },
  });

  async function link(values: z.output<typeof homeownerLinkSchema>) {
    setMessage(null);
    const result = await sendJson("POST", `/api/v1/properties/${property.id}/homeowners`, values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.message);
    }
    reset();
    router.refresh();
  }

  async function unlink(userId: string, who: string) {
    if (!window.confirm(`Unlink ${who}? They will no longer see this property.`)) return;
    const result = await sendJson(
      "DELETE",
      `/api/v1/properties/${property.id}/homeowners/${userId}`,
    );
    if (result.ok) router.refresh();
    else setMessage(result.error.message);
  }

  return (
    <div className="space-y-3">
      <ul className="space-y-2">
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
      <form
        onSubmit={handleSubmit(link)}
        className="grid gap-3 rounded-xl border border-line bg-card p-4 sm:grid-cols-[1fr_1fr_auto] sm:items-end"
        noValidate
        aria-label="Link a homeowner"
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
          Link
        </Button>
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
