// Input schemas for homeowner invitations: the manager's form and route (invite), and the
// invited person's confirmation (accept). zod/mini: the forms' bundles stay small.
import { z } from "zod/mini";

export const invitationSchema = z.strictObject({
  email: z.pipe(
    z
      .string("E-mail is required.")
      .check(
        z.trim(),
        z.toLowerCase(),
        z.minLength(1, "E-mail is required."),
        z.maxLength(320, "E-mail: at most 320 characters."),
      ),
    z.email("Enter a valid e-mail address, e.g. name@example.com."),
  ),
  name: z
    .string("Name is required.")
    .check(
      z.trim(),
      z.minLength(1, "Name is required."),
      z.maxLength(200, "Name: at most 200 characters."),
    ),
});
export type InvitationInput = z.infer<typeof invitationSchema>;

/** A manager's invitation of a technician or a manager (the People page). */
export const staffInvitationSchema = z.strictObject({
  ...invitationSchema.shape,
  role: z.enum(["technician", "manager"], "Role: choose technician or manager."),
});
export type StaffInvitationInput = z.infer<typeof staffInvitationSchema>;

export const staffInvitationParams = z.object({ invitationId: z.uuid() });

export const invitationParams = z.object({ propertyId: z.uuid(), invitationId: z.uuid() });

/** What the invited person posts: the token from the link; a name and password when the address has no account yet. */
export const acceptInvitationSchema = z.object({
  token: z
    .string("This invitation link is incomplete.")
    .check(z.regex(/^[0-9a-f]{64}$/, "This invitation link is incomplete.")),
  name: z.optional(z.string().check(z.trim(), z.maxLength(200, "Name: at most 200 characters."))),
  password: z.optional(z.string().check(z.maxLength(1024, "That password is too long."))),
});
