// Writes of homeowner invitations.
//
// Inviting (and resending) does the same work for every address — the property's row, the
// invitation row, its e-mail in the outbox (same transaction), an audit event — and never reads
// `users`: whether the address has an account, in this company or another, is not looked at until
// the person opens the link. So the manager's answer is the same, in content and in the work behind
// it, whoever the address belongs to. The property is linked only when the person confirms
// (acceptInvitation): an account of this company's homeowners is linked; an address without an
// account gets one (with the password they choose); any other account is neither joined nor named.
import "server-only";

import { createHash } from "node:crypto";
import { sql, type Transaction, type UpdateObject } from "kysely";

import { db } from "@/db";
import type { Database, Role } from "@/db/schema";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { hashPassword } from "@/lib/auth/password";
import { hashedToken, newLinkToken } from "@/lib/auth/tokens";
import { appUrl, serverEnv } from "@/lib/env";
import { AppError, notFound } from "@/lib/http/app-error";
import { enqueueMail } from "@/lib/mail/outbox";

import type { InvitationDto, StaffInvitationDto } from "./dto";
import { invitationEmail, staffInvitationEmail } from "./email";
import { INVITATION_COLUMNS, toInvitationDto, type InvitationRow } from "./map";
import { INVITATION_DAYS } from "./rules";
import type { InvitationInput, StaffInvitationInput } from "./schemas";

export const INVITATION_MAIL_KIND = "homeowner_invitation";

export const INVITATION_MESSAGES = {
  unusable:
    "This invitation link no longer works: it was used already, withdrawn, or it expired. Ask the company to send a new one.",
  unavailable:
    "This e-mail address already has a Sward account that cannot be added to this property. Ask the company to invite another address.",
  passwordNeeded: "Choose a password for your new account.",
  race: "Someone accepted an invitation for this address at the same moment. Open the link again.",
  emailInUse:
    "That e-mail address is already in use by a Sward account. Invite another address, or re-enable the person if they were disabled.",
  staffUnavailable:
    "This e-mail address has a Sward account already, so this invitation cannot make another. Ask the company to invite another address.",
} as const;

export const STAFF_INVITATION_MAIL_KIND = "staff_invitation";

const STAFF_INVITATION_COLUMNS = [...INVITATION_COLUMNS, "role"] as const;

function requireManager(actor: Actor): void {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can invite people.");
}

/** A fresh token, its stored hash and its expiry. */
function newInvitationToken() {
  const token = newLinkToken();
  return {
    token,
    tokenHash: hashedToken(token, serverEnv().AUTH_SECRET),
    expiresAt: new Date(Date.now() + INVITATION_DAYS * 86_400_000),
  };
}

function invitationUrl(token: string): string {
  return `${appUrl()}/invitation?${new URLSearchParams({ token }).toString()}`;
}

async function propertyForInvitation(trx: Transaction<Database>, actor: Actor, propertyId: string) {
  const property = await trx
    .selectFrom("properties as p")
    .innerJoin("companies as c", "c.id", "p.company_id")
    .select([
      "p.id",
      "p.street",
      "p.city",
      "p.archived_at",
      "c.name as company_name",
      "c.locale as company_locale",
    ])
    .where("p.company_id", "=", actor.companyId)
    .where("p.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  return property;
}

async function queueInvitationMail(
  trx: Transaction<Database>,
  actor: Actor,
  property: { street: string; city: string; company_name: string; company_locale: string },
  invitation: { email: string; name: string },
  token: string,
): Promise<void> {
  const mail = invitationEmail({
    link: invitationUrl(token),
    days: INVITATION_DAYS,
    companyName: property.company_name,
    name: invitation.name,
    street: property.street,
    city: property.city,
    locale: property.company_locale,
  });
  const key = createHash("sha256").update(token).digest("hex").slice(0, 40);
  await enqueueMail(trx, {
    companyId: actor.companyId,
    kind: INVITATION_MAIL_KIND,
    dedupeKey: `${INVITATION_MAIL_KIND}:${key}`,
    to: invitation.email,
    ...mail,
  });
}

/**
 * Invites an address to a property. Inviting an address that already has a pending invitation
 * there sends a new link in its place (the old one stops working).
 */
export async function inviteHomeowner(
  actor: Actor,
  propertyId: string,
  input: InvitationInput,
): Promise<InvitationDto> {
  requireManager(actor);
  const { token, tokenHash, expiresAt } = newInvitationToken();
  return db()
    .transaction()
    .execute(async (trx) => {
      const property = await propertyForInvitation(trx, actor, propertyId);
      if (property.archived_at)
        throw new AppError(
          "conflict",
          "That property is archived; restore it before inviting homeowners.",
        );
      const row = await trx
        .insertInto("homeowner_invitations")
        .values({
          company_id: actor.companyId,
          property_id: propertyId,
          email: input.email,
          name: input.name,
          token_hash: tokenHash,
          expires_at: expiresAt,
          invited_by: actor.userId,
        })
        .onConflict((oc) =>
          oc
            .columns(["property_id", "email"])
            .where("accepted_at", "is", null)
            .where("revoked_at", "is", null)
            .doUpdateSet({
              name: input.name,
              token_hash: tokenHash,
              expires_at: expiresAt,
              invited_by: actor.userId,
              sent_at: sql<Date>`now()`,
              send_count: sql<number>`homeowner_invitations.send_count + 1`,
            }),
        )
        .returning([...INVITATION_COLUMNS])
        .executeTakeFirstOrThrow();
      await queueInvitationMail(trx, actor, property, row, token);
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: "invite_homeowner",
        changes: { invitation: { from: null, to: { id: row.id, email: row.email } } },
      });
      return toInvitationDto(row);
    });
}

/** A fresh link for a pending invitation: new token, new expiry, one more sending. */
function renewedLink(tokenHash: string, expiresAt: Date) {
  return {
    token_hash: tokenHash,
    expires_at: expiresAt,
    sent_at: sql<Date>`now()`,
    send_count: sql<number>`send_count + 1`,
  };
}

/**
 * Updates the company's pending invitation `invitationId` — of `propertyId`, or a staff one when
 * it is null — and returns it; 404 when there is no such pending invitation (accepted, withdrawn,
 * another company's or another property's).
 */
async function updatePendingInvitation(
  trx: Transaction<Database>,
  actor: Actor,
  scope: { propertyId: string | null; invitationId: string },
  set: UpdateObject<Database, "homeowner_invitations">,
) {
  const row = await trx
    .updateTable("homeowner_invitations")
    .set(set)
    .where("company_id", "=", actor.companyId)
    .where((eb) =>
      scope.propertyId === null
        ? eb("property_id", "is", null)
        : eb("property_id", "=", scope.propertyId),
    )
    .where("id", "=", scope.invitationId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .returning([...STAFF_INVITATION_COLUMNS])
    .executeTakeFirst();
  if (!row) throw notFound("That invitation");
  return row;
}

/** Sends a pending invitation again with a new link (the old one stops working) and a new expiry. */
export async function resendInvitation(
  actor: Actor,
  propertyId: string,
  invitationId: string,
): Promise<InvitationDto> {
  requireManager(actor);
  const { token, tokenHash, expiresAt } = newInvitationToken();
  return db()
    .transaction()
    .execute(async (trx) => {
      const property = await propertyForInvitation(trx, actor, propertyId);
      const row = await updatePendingInvitation(
        trx,
        actor,
        { propertyId, invitationId },
        renewedLink(tokenHash, expiresAt),
      );
      await queueInvitationMail(trx, actor, property, row, token);
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: "resend_invitation",
        changes: { invitation: { from: { id: row.id }, to: { id: row.id, email: row.email } } },
      });
      return toInvitationDto(row);
    });
}

/** Withdraws a pending invitation: its link stops working at once. */
export async function revokeInvitation(
  actor: Actor,
  propertyId: string,
  invitationId: string,
): Promise<void> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await updatePendingInvitation(
        trx,
        actor,
        { propertyId, invitationId },
        { revoked_at: sql<Date>`now()`, revoked_by: actor.userId },
      );
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: "revoke_invitation",
        changes: { invitation: { from: { id: row.id, email: row.email }, to: null } },
      });
    });
}

export interface AcceptedInvitation {
  email: string;
  userId: string;
  /** The role the person has now (where they land). */
  role: Role;
  /** True when the address had no account and one was made with the chosen password. */
  createdAccount: boolean;
}

/**
 * The invited person's confirmation. The token is claimed (single use, even for two clicks at
 * once: one conditional update wins) in the transaction that links the property; when the address
 * cannot be linked here nothing is written and the invitation stays as it was, so the manager sees
 * no difference.
 */
export async function acceptInvitation(
  token: string,
  input: { name?: string; password?: string },
): Promise<AcceptedInvitation> {
  const tokenHash = hashedToken(token, serverEnv().AUTH_SECRET);
  return db()
    .transaction()
    .execute(async (trx) => {
      const invitation = await trx
        .updateTable("homeowner_invitations")
        .set({ accepted_at: sql<Date>`now()` })
        .where("token_hash", "=", tokenHash)
        .where("accepted_at", "is", null)
        .where("revoked_at", "is", null)
        .where("expires_at", ">", sql<Date>`now()`)
        .returning(["id", "company_id", "property_id", "email", "name", "role"])
        .executeTakeFirst();
      if (!invitation) throw new AppError("not_found", INVITATION_MESSAGES.unusable);
      if (invitation.role !== "homeowner" || !invitation.property_id)
        return joinStaff(trx, { ...invitation, role: invitation.role }, input);
      const propertyId = invitation.property_id;
      const user = await trx
        .selectFrom("users")
        .leftJoin("memberships", "memberships.user_id", "users.id")
        .select(["users.id", "users.disabled_at", "memberships.company_id", "memberships.role"])
        .where("users.email", "=", invitation.email)
        .forUpdate("users")
        .executeTakeFirst();
      let userId: string;
      let createdAccount = false;
      if (user) {
        if (
          user.company_id !== invitation.company_id ||
          user.role !== "homeowner" ||
          user.disabled_at
        )
          throw new AppError("conflict", INVITATION_MESSAGES.unavailable);
        userId = user.id;
      } else {
        userId = await createInvitedAccount(trx, { ...invitation, role: "homeowner" }, input);
        createdAccount = true;
      }
      await trx
        .insertInto("property_homeowners")
        .values({
          property_id: propertyId,
          user_id: userId,
          company_id: invitation.company_id,
        })
        .onConflict((oc) => oc.columns(["property_id", "user_id"]).doNothing())
        .execute();
      await trx
        .updateTable("homeowner_invitations")
        .set({ accepted_user_id: userId })
        .where("id", "=", invitation.id)
        .execute();
      await recordAudit(
        trx,
        { companyId: invitation.company_id, userId },
        {
          entity: "property",
          entityId: propertyId,
          action: "link_homeowner",
          changes: {
            homeowner: { from: null, to: invitation.email },
            invitation: { from: invitation.id, to: createdAccount ? "new account" : "accepted" },
          },
        },
      );
      return { email: invitation.email, userId, createdAccount, role: "homeowner" as const };
    });
}

/**
 * The account an invitation makes for an address that has none: the password the person chose
 * (required), the name they gave or the invited one, the address verified by the link, and the
 * membership with the invited role. Two confirmations for one address at once: one wins, the other
 * is told to open the link again.
 */
async function createInvitedAccount(
  trx: Transaction<Database>,
  invitation: { company_id: string; email: string; name: string; role: Role },
  input: { name?: string; password?: string },
): Promise<string> {
  if (!input.password)
    throw new AppError("invalid_input", INVITATION_MESSAGES.passwordNeeded, {
      password: [INVITATION_MESSAGES.passwordNeeded],
    });
  const passwordHash = await hashPassword(input.password);
  const created = await trx
    .insertInto("users")
    .values({
      email: invitation.email,
      name: input.name?.trim() || invitation.name,
      password_hash: passwordHash,
      email_verified: sql<Date>`now()`,
    })
    .onConflict((oc) => oc.column("email").doNothing())
    .returning("id")
    .executeTakeFirst();
  if (!created) throw new AppError("conflict", INVITATION_MESSAGES.race);
  await trx
    .insertInto("memberships")
    .values({ company_id: invitation.company_id, user_id: created.id, role: invitation.role })
    .execute();
  return created.id;
}

/**
 * A staff invitation's confirmation (the token already claimed in `trx`): a new account of the
 * inviting company with the invited role and the password chosen. An address that has an account
 * by now (made since the invitation was sent) is refused and nothing is written.
 */
async function joinStaff(
  trx: Transaction<Database>,
  invitation: { id: string; company_id: string; email: string; name: string; role: Role },
  input: { name?: string; password?: string },
): Promise<AcceptedInvitation> {
  const existing = await trx
    .selectFrom("users")
    .select("id")
    .where("email", "=", invitation.email)
    .executeTakeFirst();
  if (existing) throw new AppError("conflict", INVITATION_MESSAGES.staffUnavailable);
  const created = { id: await createInvitedAccount(trx, invitation, input) };
  await trx
    .updateTable("homeowner_invitations")
    .set({ accepted_user_id: created.id })
    .where("id", "=", invitation.id)
    .execute();
  await recordAudit(
    trx,
    { companyId: invitation.company_id, userId: created.id },
    {
      entity: "person",
      entityId: created.id,
      action: "join_staff",
      changes: {
        role: { from: null, to: invitation.role },
        invitation: { from: invitation.id, to: "accepted" },
      },
    },
  );
  return {
    email: invitation.email,
    userId: created.id,
    createdAccount: true,
    role: invitation.role,
  };
}

// ── Staff invitations (technicians and managers): the same table, token, e-mail outbox and
// confirmation page as homeowner invitations; no property. Unlike a homeowner's, an address
// already in use by any Sward account is refused in words, because staff accounts are made here.

function toStaffInvitationDto(row: InvitationRow & { role: Role }): StaffInvitationDto {
  return { ...toInvitationDto(row), role: row.role === "manager" ? "manager" : "technician" };
}

async function companyForInvitation(trx: Transaction<Database>, actor: Actor) {
  return trx
    .selectFrom("companies")
    .select(["name", "locale"])
    .where("id", "=", actor.companyId)
    .executeTakeFirstOrThrow();
}

async function queueStaffInvitationMail(
  trx: Transaction<Database>,
  actor: Actor,
  invitation: { email: string; name: string; role: Role },
  token: string,
): Promise<void> {
  const company = await companyForInvitation(trx, actor);
  const mail = staffInvitationEmail({
    link: invitationUrl(token),
    days: INVITATION_DAYS,
    companyName: company.name,
    name: invitation.name,
    role: invitation.role === "manager" ? "manager" : "technician",
    locale: company.locale,
  });
  const key = createHash("sha256").update(token).digest("hex").slice(0, 40);
  await enqueueMail(trx, {
    companyId: actor.companyId,
    kind: STAFF_INVITATION_MAIL_KIND,
    dedupeKey: `${STAFF_INVITATION_MAIL_KIND}:${key}`,
    to: invitation.email,
    ...mail,
  });
}

/** Invites a technician or a manager; inviting an address with a pending staff invitation sends a new link in its place. */
export async function inviteStaff(
  actor: Actor,
  input: StaffInvitationInput,
): Promise<StaffInvitationDto> {
  requireManager(actor);
  const { token, tokenHash, expiresAt } = newInvitationToken();
  return db()
    .transaction()
    .execute(async (trx) => {
      const inUse = await trx
        .selectFrom("users")
        .select("id")
        .where("email", "=", input.email)
        .executeTakeFirst();
      if (inUse)
        throw new AppError("conflict", INVITATION_MESSAGES.emailInUse, {
          email: [INVITATION_MESSAGES.emailInUse],
        });
      const row = await trx
        .insertInto("homeowner_invitations")
        .values({
          company_id: actor.companyId,
          property_id: null,
          role: input.role,
          email: input.email,
          name: input.name,
          token_hash: tokenHash,
          expires_at: expiresAt,
          invited_by: actor.userId,
        })
        .onConflict((oc) =>
          oc
            .columns(["company_id", "email"])
            .where("property_id", "is", null)
            .where("accepted_at", "is", null)
            .where("revoked_at", "is", null)
            .doUpdateSet({
              name: input.name,
              role: input.role,
              token_hash: tokenHash,
              expires_at: expiresAt,
              invited_by: actor.userId,
              sent_at: sql<Date>`now()`,
              send_count: sql<number>`homeowner_invitations.send_count + 1`,
            }),
        )
        .returning([...STAFF_INVITATION_COLUMNS])
        .executeTakeFirstOrThrow();
      await queueStaffInvitationMail(trx, actor, row, token);
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: row.id,
        action: "invite_staff",
        changes: { invitation: { from: null, to: { email: row.email, role: row.role } } },
      });
      return toStaffInvitationDto(row);
    });
}

/** Sends a pending staff invitation again with a new link (the old one stops working). */
export async function resendStaffInvitation(
  actor: Actor,
  invitationId: string,
): Promise<StaffInvitationDto> {
  requireManager(actor);
  const { token, tokenHash, expiresAt } = newInvitationToken();
  return db()
    .transaction()
    .execute(async (trx) => {
      const row = await updatePendingInvitation(
        trx,
        actor,
        { propertyId: null, invitationId },
        renewedLink(tokenHash, expiresAt),
      );
      await queueStaffInvitationMail(trx, actor, row, token);
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: row.id,
        action: "resend_invitation",
        changes: { invitation: { from: { id: row.id }, to: { id: row.id, email: row.email } } },
      });
      return toStaffInvitationDto(row);
    });
}

/** Withdraws a pending staff invitation: its link stops working at once. */
export async function revokeStaffInvitation(actor: Actor, invitationId: string): Promise<void> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await updatePendingInvitation(
        trx,
        actor,
        { propertyId: null, invitationId },
        { revoked_at: sql<Date>`now()`, revoked_by: actor.userId },
      );
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: row.id,
        action: "revoke_invitation",
        changes: { invitation: { from: { email: row.email, role: row.role }, to: null } },
      });
    });
}
