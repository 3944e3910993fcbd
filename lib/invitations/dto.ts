// What invitation data leaves the server. A pending invitation says nothing about whether the
// address has an account anywhere: the manager sees the same fields for every address.
export interface InvitationDto {
  id: string;
  email: string;
  name: string;
  /** When the link was last sent (ISO). */
  sentAt: string;
  /** When the last link stops working (ISO). */
  expiresAt: string;
  isExpired: boolean;
  sendCount: number;
}

/** A pending invitation of a technician or a manager (the People page). */
export interface StaffInvitationDto extends InvitationDto {
  role: "manager" | "technician";
}

/** What the invited person sees on opening the link (only ever shown to the holder of the token). */
export type InvitationView =
  | { state: "unknown" }
  | {
      state: "accepted" | "revoked" | "expired";
      companyName: string;
    }
  | {
      state: "pending";
      companyName: string;
      email: string;
      name: string;
      /** What accepting makes them: a homeowner of the property below, or staff of the company. */
      role: "homeowner" | "technician" | "manager";
      /** The property (empty for a staff invitation). */
      street: string;
      city: string;
      expiresAt: string;
      /** The company's time zone, for showing the expiry. */
      timeZone: string;
      /** new: no account yet (a password is set); homeowner: an account of this company, linked on confirmation; unavailable: an account that cannot be linked here. */
      account: "new" | "homeowner" | "unavailable";
    };
