// The one way a form validates: react-hook-form with the domain's shared zod/mini schema
// (lib/<domain>/schemas.ts) and the plain-English messages the server uses too.
import { zodResolver } from "@hookform/resolvers/zod";
import type { FieldValues, Resolver } from "react-hook-form";
import type { z } from "zod/mini";

import { plainErrors } from "@/lib/plain-errors";

export const formResolver = <S extends z.ZodMiniType<FieldValues, FieldValues>>(
  schema: S,
): Resolver<z.input<S>, unknown, z.output<S>> =>
  zodResolver(schema, { error: plainErrors }) as Resolver<z.input<S>, unknown, z.output<S>>;
