// The catalogue's words every staff page hands to the client: what waits on the phone (lib/offline)
// and a conflict's fields, since the outbox works from any staff page. A page that wraps part of
// itself in a NextIntlClientProvider of its own passes these too: a nested provider's messages
// replace the outer ones, they are not merged (without them the visit page showed
// "offline.savedWaiting" instead of its words).
import type { getMessages } from "next-intl/server";

export function staffClientMessages(messages: Awaited<ReturnType<typeof getMessages>>) {
  const { fields, blank, yes, no, symptoms } = messages.audit;
  return { offline: messages.offline, audit: { fields, blank, yes, no, symptoms } };
}
