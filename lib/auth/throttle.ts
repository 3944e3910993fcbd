// Sign-in throttling policy (pure), over a sliding window. Failed attempts are counted
//   - per e-mail address *and* client address (whether or not an account exists, so the answer
//     reveals nothing): a guesser locks only itself out of that account, never its owner;
//   - per client address, across accounts (one address spraying many accounts);
//   - per e-mail address across all addresses, with a much higher limit, for a guesser spread
//     over many real addresses. That limit does not apply to an address that signed in to the
//     account successfully within KNOWN_ADDRESS_DAYS, so its owner still gets in.
// Client addresses cannot be chosen by the client (lib/http/edge-address.mjs).
export interface ThrottleLimits {
  /** Failures of one account from one address. */
  maxPerAccount: number;
  maxPerAddress: number;
  /** Failures of one account from all addresses together (known addresses exempt). */
  maxPerAccountAllAddresses: number;
  windowMinutes: number;
}

export interface RecentFailures {
  /** Failures of this account from this address. */
  forAccountFromAddress: number;
  /** Failures of any account from this address. */
  fromAddress: number;
  /** Failures of this account from any address. */
  forAccount: number;
  /** This address signed in to this account successfully within KNOWN_ADDRESS_DAYS. */
  isKnownAddress: boolean;
}

export const KNOWN_ADDRESS_DAYS = 30;

export function isThrottled(failures: RecentFailures, limits: ThrottleLimits): boolean {
  return (
    failures.forAccountFromAddress >= limits.maxPerAccount ||
    failures.fromAddress >= limits.maxPerAddress ||
    (!failures.isKnownAddress && failures.forAccount >= limits.maxPerAccountAllAddresses)
  );
}

/** E-mail addresses compare case-insensitively and without surrounding spaces. */
export function normaliseEmail(email: string): string {
  return email.trim().toLowerCase();
}
