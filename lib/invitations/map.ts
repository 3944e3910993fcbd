// Row → DTO for invitations.
import type { InvitationDto } from "./dto";

export interface InvitationRow {
  id: string;
  email: string;
  name: string;
  sent_at: Date;
  expires_at: Date;
  send_count: number;
}

export const INVITATION_COLUMNS = [
  "id",
  "email",
  "name",
  "sent_at",
  "expires_at",
  "send_count",
] as const;

export function toInvitationDto(row: InvitationRow, now: Date = new Date()): InvitationDto {
  return {
    id: row.id,
    email: row.email,
    name: row.name,
    sentAt: row.sent_at.toISOString(),
    expiresAt: row.expires_at.toISOString(),
    isExpired: row.expires_at.getTime() <= now.getTime(),
    sendCount: row.send_count,
  };
}
