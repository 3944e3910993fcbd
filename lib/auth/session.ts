// Turns the current request into an Actor (or null): the JWT names a session, the database
// says whether it is still valid and who is behind it. Memoised per request.
import "server-only";
import { cache } from "react";
import type { Actor } from "./actor";
import { auth } from "./config";
import { findActorBySession } from "./queries";

export const getActor = cache(async (): Promise<Actor | null> => {
  const session = (await auth()) as { sessionId?: string } | null;
  if (!session?.sessionId) return null;
  return (await findActorBySession(session.sessionId)) ?? null;
});
