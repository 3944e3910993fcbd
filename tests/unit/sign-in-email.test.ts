// The sign-in link e-mail: the link in both parts, how long it works, and stored names rendered inert.
import { describe, expect, it } from "vitest";

import { signInLinkEmail } from "@/lib/mail/sign-in-email";

describe("signInLinkEmail", () => {
  const link =
    "http://localhost:3000/sign-in/link?callbackUrl=%2Fmy-lawn&token=abc&email=o%40x.test";
  it("carries the link in the text and the HTML, says it works once within the minutes given", () => {
    const mail = signInLinkEmail({
      link,
      minutes: 15,
      companyName: "Larkmoor Lawn Care",
      name: "Margaret Oyelaran",
    });
    expect(mail.subject).toBe("Your sign-in link for Larkmoor Lawn Care");
    expect(mail.text).toContain(link);
    expect(mail.text).toMatch(/It works once, within 15 minutes/);
    expect(mail.html).toContain(link.replace(/&/g, "&amp;"));
    expect(mail.text).toMatch(/If you did not ask to sign in, ignore this e-mail/);
  });
  it("renders a name or company with HTML in it as text", () => {
    const mail = signInLinkEmail({
      link,
      minutes: 15,
      companyName: "<b>Co</b>",
      name: `<img src=x onerror="alert(1)">`,
    });
    expect(mail.html).not.toMatch(/<img|<b>/);
    expect(mail.html).toContain("&lt;img src=x onerror=&quot;alert(1)&quot;&gt;");
  });
});
