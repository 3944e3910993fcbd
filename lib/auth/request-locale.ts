// next-intl's request configuration (App Router, no locale in the URL): the locale is the signed-in
// person's company setting (companies.locale), US English for everyone signed out. It lives with
// the session it reads (lib/i18n knows no one signed in; next.config.ts names this file).
import { getRequestConfig } from "next-intl/server";

import { localeChoice } from "@/lib/i18n/locales";
import { messagesFor } from "@/lib/i18n/translate";

import { getActor } from "./session";

export default getRequestConfig(async () => {
  const actor = await getActor();
  const locale = localeChoice(actor?.companyLocale).tag;
  return {
    locale,
    messages: messagesFor(locale),
    timeZone: actor?.companyTimeZone ?? "UTC",
  };
});
