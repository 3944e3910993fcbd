// next-intl's request configuration (App Router, no locale in the URL): the locale is the signed-in
// person's company setting (companies.locale), US English for everyone signed out.
import { getRequestConfig } from "next-intl/server";

import { getActor } from "@/lib/auth/session";

import { localeChoice } from "./locales";
import { messagesFor } from "./translate";

export default getRequestConfig(async () => {
  const actor = await getActor();
  const locale = localeChoice(actor?.companyLocale).tag;
  return {
    locale,
    messages: messagesFor(locale),
    timeZone: actor?.companyTimeZone ?? "UTC",
  };
});
