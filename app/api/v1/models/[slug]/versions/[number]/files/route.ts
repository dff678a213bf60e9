/**
 * A version's files. POST attaches one supplementary file sent as multipart/form-data
 * (CSV, plain text, PDF or ZIP up to 50 MB); it streams into the content-addressed store
 * with its type checked against its content, and the client's name kept as metadata only.
 */
import { actorFromRequest, requireActor } from "@/lib/authz";
import { attachSupplement } from "@/lib/files";
import { json, route } from "@/lib/http";
import { declaredLength, readCapped } from "@/lib/storage";
import { getVersion } from "@/lib/versions";
import { viewerOf, type VersionContext } from "../../../../../_support/actor";
import { firstFilePart, MAX_FIELD_BYTES } from "../../../../../_support/multipart";
import { versionNumber } from "../../../../../_support/params";

/** Room for the multipart framing and skipped fields around the file itself. */
const FRAMING_BYTES = MAX_FIELD_BYTES + 16 * 1024;

export const GET = route(async (req, ctx: VersionContext) => {
  const { slug, number } = await ctx.params;
  const viewer = viewerOf(await actorFromRequest(req));
  const version = await getVersion(slug, versionNumber(number), viewer);
  return json({ files: version.files });
});

export const POST = route(async (req, ctx: VersionContext) => {
  const { slug, number } = await ctx.params;
  const viewer = viewerOf(await requireActor(req));
  const version = await getVersion(slug, versionNumber(number), viewer);
  const total = declaredLength(req);
  // The file is at most the body less its framing: a body declared too large is refused before
  // a byte is read (readCapped of no body only applies the declared-length check).
  const fileAtMost = total === null ? null : total - FRAMING_BYTES;
  await readCapped(null, "supplement", fileAtMost);
  const part = await firstFilePart(req.body, req.headers.get("content-type"));
  const file = await attachSupplement(version.id, viewer, { body: part.stream, name: part.filename, declaredLength: fileAtMost });
  return json({ file }, { status: 201, headers: { Location: `/api/v1/files/${file.id}` } });
});
