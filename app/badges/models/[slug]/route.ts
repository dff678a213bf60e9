/** /badges/models/rp-xxxxxx.svg: the model's latest decided version (short cache, ETag). */
import { modelBadgeSvg } from "@/lib/badges";
import { modelBadgeSource } from "@/lib/decisions";
import { NotFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { SHORT, cachePolicy, stripSvg, svgResponse } from "../../_support/respond";

export const GET = route(async (req, ctx: { params: Promise<{ slug: string }> }) => {
  const { slug } = await ctx.params;
  const source = await modelBadgeSource(stripSvg(slug));
  if (source === null) throw new NotFound("badge");
  const policy = await cachePolicy(req, source.model, SHORT);
  return svgResponse(req, modelBadgeSvg(source.facts), policy);
});
