// GET /api/v1/photos/:photoId/display|thumb — the WebP derivative, for staff of the company and
// the property's homeowner (finished visits only); 404 otherwise. Content-addressed, so cacheable
// privately for a year.
import { z } from "zod";

import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { notFound } from "@/lib/http/app-error";
import { getPhotoFile } from "@/lib/photos/queries";
import { services } from "@/lib/services";

const params = z.object({ photoId: z.uuid(), variant: z.enum(["display", "thumb"]) });

export const GET = route(
  { access: ROLES, params, resource: "That photo" },
  async ({ actor, params, request }) => {
    const file = await getPhotoFile(actor, params.photoId, params.variant);
    const etag = `"${file.hash}-${params.variant}"`;
    const headers = {
      "Content-Type": "image/webp",
      "Content-Disposition": `inline; filename="${file.fileName.replace(/[^A-Za-z0-9._-]+/g, "-")}"`,
      "Cache-Control": "private, max-age=31536000, immutable",
      ETag: etag,
      "X-Content-Type-Options": "nosniff",
    };
    if (request.headers.get("if-none-match") === etag)
      return new Response(null, { status: 304, headers });
    const body = await services().photoStorage.get(file.key);
    if (!body) throw notFound("That photo");
    return new Response(new Uint8Array(body), {
      status: 200,
      headers: { ...headers, "Content-Length": String(body.length) },
    });
  },
);
