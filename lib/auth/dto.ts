// What the sign-in and sign-in-link reads return.
import type { Role } from "@/db/schema";

export interface SignInCandidate {
  userId: string;
  passwordHash: string | null;
  isDisabled: boolean;
  role: Role | null;
}

export interface Homeowner {
  userId: string;
  email: string;
  name: string;
  emailVerified: Date | null;
  companyId: string;
  companyName: string;
  /** The company's locale: the words and dates of the e-mails it sends. */
  companyLocale: string;
}

export interface LinkUser {
  id: string;
  email: string;
  name: string;
  emailVerified: Date | null;
}
