// Sign-in throttling policy (pure). Failed attempts are counted per e-mail address (whether or not
// an account exists, so the answer reveals nothing) and per client address, over a sliding window.
export interface ThrottleLimits {
  maxPerAccount: number;
  maxPerAddress: number;
  windowMinutes: number;
}

export interface RecentFailures {
  forAccount: number;
  fromAddress: number;
}

export function isThrottled(failures: RecentFailures, limits: ThrottleLimits): boolean {
  return (
    failures.forAccount >= limits.maxPerAccount || failures.fromAddress >= limits.maxPerAddress
  );
}

/** E-mail addresses compare case-insensitively and without surrounding spaces. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}
