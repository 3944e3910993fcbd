// Checks an e-mail + password sign-in: throttling first, then Argon2id verification. Unknown
// e-mails cost the same work as known ones and get the same answer.
import "server-only";

import { serverEnv } from "@/lib/env";
import { log, maskEmail } from "@/lib/log";

import { recordSignInAttempt } from "./mutations";
import { decoyPasswordHash, verifyPassword } from "./password";
import { countRecentFailures, findSignInCandidate } from "./queries";
import { isThrottled, normaliseEmail } from "./throttle";

export type CredentialCheck =
  { ok: true; userId: string } | { ok: false; reason: "invalid" | "throttled" };

export async function checkCredentials(input: {
  email: string;
  password: string;
  address: string;
}): Promise<CredentialCheck> {
  const env = serverEnv();
  const emailKey = normaliseEmail(input.email);
  const limits = {
    maxPerAccount: env.SIGN_IN_MAX_PER_ACCOUNT,
    maxPerAddress: env.SIGN_IN_MAX_PER_ADDRESS,
    maxPerAccountAllAddresses: env.SIGN_IN_MAX_PER_ACCOUNT_ALL_ADDRESSES,
    windowMinutes: env.SIGN_IN_WINDOW_MINUTES,
  };
  const failures = await countRecentFailures(emailKey, input.address, limits.windowMinutes);
  if (isThrottled(failures, limits)) {
    log.warn(
      {
        event: "sign_in_throttled",
        method: "password",
        user: maskEmail(emailKey),
        address: input.address,
      },
      "sign-in refused: too many failures",
    );
    return { ok: false, reason: "throttled" };
  }

  const candidate = await findSignInCandidate(emailKey);
  const hashToCheck = candidate?.passwordHash ?? (await decoyPasswordHash());
  const isMatch = await verifyPassword(hashToCheck, input.password);
  const isAllowed =
    isMatch && candidate !== undefined && !candidate.isDisabled && candidate.role !== null;

  await recordSignInAttempt(emailKey, input.address, isAllowed);
  // JSON lines (pino): a value with CR/LF in it is escaped inside its string and cannot start a line of its own.
  if (isAllowed)
    log.info(
      { event: "sign_in", method: "password", userId: candidate.userId, address: input.address },
      "signed in",
    );
  else
    log.warn(
      {
        event: "sign_in_failed",
        method: "password",
        user: maskEmail(emailKey),
        address: input.address,
      },
      "sign-in refused: wrong e-mail or password",
    );
  return isAllowed ? { ok: true, userId: candidate.userId } : { ok: false, reason: "invalid" };
}
