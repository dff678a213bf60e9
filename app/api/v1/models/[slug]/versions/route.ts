/**
 * A model's versions. POST uploads a specification: the raw JSON as the body
 * (Content-Type: application/json), or one file in multipart/form-data (the upload widget,
 * `curl -F spec=@model.json`). Identical content answers 200 and makes no version; a new
 * version answers 201 and is queued for verification. Schema problems answer 422 with every
 * problem's JSON pointer and line; nothing is stored for them.
 */
import { actorFromRequest, requireActor } from "@/lib/authz";
import { ValidationError } from "@/lib/errors";
import { json, route } from "@/lib/http";
import { loadEditableModel } from "@/lib/models";
import { declaredLength, decodeSpecBytes, readCapped, sanitizeFileName, typeRuleFor } from "@/lib/storage";
import { addVersion, listVersions } from "@/lib/versions";
import { viewerOf, type SlugContext } from "../../../_support/actor";
import { firstFilePart, multipartBoundary } from "../../../_support/multipart";
import { UNSUPPORTED_SPEC_TYPE_MESSAGE } from "../../../_support/params";

function isJsonType(contentType: string | null): boolean {
  const type = contentType?.split(";")[0]?.trim().toLowerCase() ?? "";
  return type === "application/json" || (type.startsWith("application/") && type.endsWith("+json"));
}

export const GET = route(async (req, ctx: SlugContext) => {
  const { slug } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  return json({ versions: await listVersions(slug, viewer) });
});

export const POST = route(async (req, ctx: SlugContext) => {
  const { slug } = await ctx.params;
  const viewer = viewerOf(await requireActor(req));
  // Access first: someone who may not see the model learns nothing from size or format errors.
  const model = await loadEditableModel(slug, viewer);

  const contentType = req.headers.get("content-type");
  let bytes: Uint8Array;
  let fileName = "spec.json";
  if (multipartBoundary(contentType) !== null) {
    const part = await firstFilePart(req.body, contentType);
    fileName = sanitizeFileName(part.filename);
    typeRuleFor(fileName, "spec");
    bytes = await readCapped(part.stream, "spec");
  } else if (isJsonType(contentType)) {
    bytes = await readCapped(req.body, "spec", declaredLength(req));
  } else {
    throw new ValidationError(UNSUPPORTED_SPEC_TYPE_MESSAGE, [{ path: "", message: `Content-Type was ${contentType ?? "missing"}.` }], 400);
  }

  const result = await addVersion(model.id, decodeSpecBytes(bytes), viewer, { fileName });
  const n = result.version.number;
  if (result.status === "identical") {
    return json({ ...result, message: `Identical to v${n}: no new version was made.` }, { status: 200 });
  }
  return json(
    { ...result, message: `Version v${n} was made; its verification is queued.` },
    { status: 201, headers: { Location: `/api/v1/models/${model.slug}/versions/${n}` } },
  );
});
