/**
 * /badges/models/rp-xxxxxx/v/3.svg: one version's verdict and decision. Immutable (a year,
 * `immutable`) once the version has both; until then a short cache, so the badge catches up.
 */
import { versionBadgeSvg } from "@/lib/badges";
import { versionBadgeSource } from "@/lib/decisions";
import { NotFound } from "@/lib/errors";
import { route } from "@/lib/http";
import { IMMUTABLE, SHORT, cachePolicy, stripSvg, svgResponse } from "../../../../_support/respond";

export const GET = route(async (req, ctx: { params: Promise<{ slug: string; number: string }> }) => {
  const { slug, number } = await ctx.params;
  const n = stripSvg(number);
  if (!/^[1-9]\d{0,8}$/.test(n)) throw new NotFound("badge");
  const source = await versionBadgeSource(slug, Number(n));
  if (source === null) throw new NotFound("badge");
  const policy = await cachePolicy(req, source.model, source.final ? IMMUTABLE : SHORT);
  return svgResponse(req, versionBadgeSvg(source.facts), policy);
});
