// The outbox's back-off per message: doubling from 30 s and capped at an hour (exponential
// back-off with a cap, as in RFC 5321 §4.5.4.1's advice that retries be spaced and give up the
// fast pace after the first tries — common practice for mail queues).
import { describe, expect, it } from "vitest";

import { retryDelaySeconds } from "@/lib/mail/outbox";

describe("retryDelaySeconds", () => {
  it("waits 30 s after the first failure, then doubles, and never more than an hour", () => {
    expect([1, 2, 3, 4, 5, 6].map(retryDelaySeconds)).toEqual([30, 60, 120, 240, 480, 960]);
    expect(retryDelaySeconds(8)).toBe(3600);
    expect(retryDelaySeconds(40)).toBe(3600);
  });
});
