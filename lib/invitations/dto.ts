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
      street: string;
      city: string;
      expiresAt: string;
      /** The company's time zone, for showing the expiry. */
      timeZone: string;
      /** new: no account yet (a password is set); homeowner: an account of this company, linked on confirmation; unavailable: an account that cannot be linked here. */
      account: "new" | "homeowner" | "unavailable";
    };
