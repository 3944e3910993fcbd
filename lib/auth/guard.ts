// The one guard that builds every route handler and server action:
//   session → actor from the database → role → zod parse → call → typed errors.
// Security decisions live here and in the data-access layer, never only in a layout or proxy.
import { unstable_rethrow } from "next/navigation";
import { z } from "zod";

import type { Role } from "@/db/schema";
import { AppError, notFound, toErrorBody } from "@/lib/http/app-error";
import {
  CONTROL_CHARACTER_MESSAGE,
  fieldsWithControlCharacters,
} from "@/lib/http/control-characters";
import { isSameSiteWrite } from "@/lib/http/origin";
import { readBodyLimited } from "@/lib/http/read-body";
import { log } from "@/lib/log";
import { plainErrors } from "@/lib/plain-errors";

import type { Actor } from "./actor";

type Access = readonly Role[] | "public";
type ActorFor<A extends Access> = A extends "public" ? Actor | null : Actor;
type RouteContext = { params: Promise<Record<string, string | string[] | undefined>> };

export type ActionResult<T> =
  | { ok: true; data: T }
  | {
      ok: false;
      error: {
        code: string;
        message: string;
        fieldErrors?: Record<string, string[]>;
        details?: Record<string, unknown>;
      };
    };

const MUTATING = new Set(["POST", "PUT", "PATCH", "DELETE"]);
/** Refused authorisations, logged (ASVS V16): not signed in, not allowed. "Not found" is routine and is not. */
const REFUSALS = new Set(["unauthenticated", "forbidden"]);

/** Any zod schema: full zod on the server, zod/mini where a browser form shares it. */
type Schema = z.core.$ZodType;

/** Parses with the plain-English messages of lib/plain-errors.ts. */
const parse = <S extends Schema>(schema: S, input: unknown) =>
  z.safeParse(schema, input, { error: plainErrors });

function invalid(error: z.core.$ZodError, message = "Some values need attention."): AppError {
  const fieldErrors = z.flattenError(error).fieldErrors as Record<string, string[]>;
  // A nested field (a program's rounds.2.endMd) is also named by its whole path, so a form of
  // repeated rows can put the message beside the row's own field.
  for (const issue of error.issues) {
    if (issue.path.length < 2) continue;
    const key = issue.path.map(String).join(".");
    (fieldErrors[key] ??= []).push(issue.message);
  }
  return new AppError("invalid_input", message, fieldErrors);
}

/** The largest JSON body a route reads unless it says otherwise: the largest form (a product with
 *  its 4,000-character label cautions) is under 32 KiB even in 4-byte characters. */
const DEFAULT_MAX_BODY_BYTES = 64 * 1024;

/** 422 when any text of the input (a value or a key) holds a control character or a lone surrogate. */
function refuseControlCharacters(input: unknown, message = "Some values need attention."): void {
  const fields = fieldsWithControlCharacters(input);
  if (fields.length)
    throw new AppError(
      "invalid_input",
      message,
      Object.fromEntries(fields.map((f) => [f || "body", [CONTROL_CHARACTER_MESSAGE]])),
    );
}

function authorise<A extends Access>(actor: Actor | null, access: A): ActorFor<A> {
  if (access === "public") return actor as ActorFor<A>;
  if (!actor) throw new AppError("unauthenticated", "Sign in to continue.");
  if (!access.includes(actor.role)) throw new AppError("forbidden", "Your role cannot do this.");
  return actor as ActorFor<A>;
}

/** Refuses cross-site mutations: the Origin (or Fetch Metadata) must name this site. */
function assertSameOrigin(request: Request): void {
  if (MUTATING.has(request.method) && !isSameSiteWrite(request.headers))
    throw new AppError("forbidden", "Cross-site requests are refused.");
}

export function createGuards(resolveActor: () => Promise<Actor | null>) {
  function route<
    A extends Access,
    P extends Schema = z.ZodType<Record<string, never>>,
    Q extends Schema = z.ZodType<Record<string, never>>,
    B extends Schema = z.ZodType<undefined>,
  >(
    spec: {
      access: A;
      params?: P;
      query?: Q;
      body?: B;
      /** The largest body read (bytes, default DEFAULT_MAX_BODY_BYTES): a larger one is 413, refused
       *  from its Content-Length before reading, or as soon as the count passes it while streaming. */
      maxBodyBytes?: number;
      /** e.g. "That property": names what a bad id fails to find */ resource?: string;
    },
    handler: (ctx: {
      actor: ActorFor<A>;
      params: z.output<P>;
      query: z.output<Q>;
      body: z.output<B>;
      request: Request;
    }) => Promise<unknown>,
  ) {
    return async (request: Request, context?: RouteContext): Promise<Response> => {
      try {
        assertSameOrigin(request);
        const actor = authorise(await resolveActor(), spec.access);
        const rawParams = (await context?.params) ?? {};
        const params = spec.params
          ? parse(spec.params, rawParams)
          : { success: true as const, data: {} };
        // A malformed id cannot name a record in scope: answer as for any unknown record.
        if (!params.success) throw notFound(spec.resource);
        const url = new URL(request.url);
        const query = spec.query
          ? parse(spec.query, Object.fromEntries(url.searchParams))
          : { success: true as const, data: {} };
        if (!query.success)
          throw invalid(query.error, "The query string has values that are not allowed.");
        // After the schema: search text strips control characters there (harmless); any other
        // query value that still holds one is refused.
        refuseControlCharacters(query.data, "The query string has values that are not allowed.");
        let body: unknown = undefined;
        if (spec.body) {
          const bytes = await readBodyLimited(
            request,
            spec.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES,
            "The request body",
          );
          let json: unknown;
          try {
            // A DELETE may come without a body: it is then an empty object.
            json =
              bytes.length === 0 && request.method === "DELETE"
                ? {}
                : JSON.parse(new TextDecoder().decode(bytes));
          } catch {
            throw new AppError("invalid_input", "The request body must be JSON.");
          }
          refuseControlCharacters(json);
          const parsed = parse(spec.body, json);
          if (!parsed.success) throw invalid(parsed.error);
          body = parsed.data;
        }
        const result = await handler({
          actor,
          params: params.data as z.output<P>,
          query: query.data as z.output<Q>,
          body: body as z.output<B>,
          request,
        });
        if (result instanceof Response) return result;
        return Response.json(result, { headers: { "Cache-Control": "private, no-store" } });
      } catch (err) {
        if (!(err instanceof AppError))
          log.error({ err, path: new URL(request.url).pathname }, "route failed");
        else if (REFUSALS.has(err.code))
          log.warn(
            {
              event: "access_refused",
              code: err.code,
              method: request.method,
              path: new URL(request.url).pathname,
            },
            "request refused",
          );
        const { status, body } = toErrorBody(err);
        return Response.json(body, { status, headers: { "Cache-Control": "no-store" } });
      }
    };
  }

  function action<A extends Access, I extends Schema, T>(
    spec: { access: A; input: I },
    handler: (ctx: { actor: ActorFor<A>; input: z.output<I> }) => Promise<T>,
  ) {
    return async (raw: unknown): Promise<ActionResult<T>> => {
      try {
        const actor = authorise(await resolveActor(), spec.access);
        const source = raw instanceof FormData ? Object.fromEntries(raw) : raw;
        refuseControlCharacters(source);
        const parsed = parse(spec.input, source);
        if (!parsed.success) throw invalid(parsed.error);
        return { ok: true, data: await handler({ actor, input: parsed.data }) };
      } catch (err) {
        unstable_rethrow(err); // let Next's redirect() and notFound() through
        if (!(err instanceof AppError)) log.error({ err }, "action failed");
        else if (REFUSALS.has(err.code))
          log.warn(
            { event: "access_refused", code: err.code, action: handler.name || "action" },
            "action refused",
          );
        return { ok: false, error: toErrorBody(err).body.error };
      }
    };
  }

  return { route, action };
}
