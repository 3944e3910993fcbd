// The app's guards, bound to the real session. Build every route handler with `route` and
// every server action with `action`.
import "server-only";

import { createGuards } from "./guard";
import { getActor } from "./session";

export const { route, action } = createGuards(getActor);
