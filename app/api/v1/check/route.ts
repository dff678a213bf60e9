/**
 * POST /api/v1/check: verifies a posted spec (restpoint/model@1 JSON) and returns the report.
 * Stateless: nothing is stored. Bodies over 1 MB get 413 before they are read whole; each
 * client gets a token bucket (429 with Retry-After past it); the engine runs on the check
 * thread of lib/check-pool.ts with a short budget (503 when its backlog is full or a run overruns).
 */
import { CHECK_MAX_BYTES, CheckUnavailable, runCheck } from "@/lib/check-pool";
import { PayloadTooLarge, RateLimited, ValidationError } from "@/lib/errors";
import { errorResponse, json } from "@/lib/http";
import { clientKey, TokenBucketLimiter } from "@/lib/rate-limit";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

/** A burst of 10 re-runs, then one every 3 seconds per client. */
const limiter = ((globalThis as unknown as { __restpointCheckLimiter?: TokenBucketLimiter }).__restpointCheckLimiter ??=
  new TokenBucketLimiter({ capacity: 10, refillPerSecond: 1 / 3, maxClients: 10_000 }));

function tooLarge(limit: number): PayloadTooLarge {
  return new PayloadTooLarge(limit, `The specification is larger than the limit of 1 MB (${limit.toLocaleString("en-US")} bytes).`);
}

/** Reads at most `limit` bytes of the body; throws PayloadTooLarge as soon as it is exceeded. */
async function readLimited(req: Request, limit: number): Promise<string> {
  const declared = req.headers.get("content-length");
  if (declared !== null && Number(declared) > limit) throw tooLarge(limit);
  if (req.body === null) return "";
  const reader = req.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel();
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const all = new Uint8Array(size);
  let at = 0;
  for (const c of chunks) {
    all.set(c, at);
    at += c.byteLength;
  }
  return new TextDecoder().decode(all);
}

export async function POST(req: Request): Promise<Response> {
  try {
    const decision = limiter.take(clientKey(req.headers));
    if (!decision.allowed) {
      throw new RateLimited(decision.retryAfterSeconds, "Too many re-runs from this address. Wait a moment and try again.");
    }
    const text = await readLimited(req, CHECK_MAX_BYTES);
    if (text.trim() === "") {
      throw new ValidationError("Send the specification as the request body (restpoint/model@1 JSON).", [], 400);
    }
    const report = await runCheck(text);
    const headers = { "Cache-Control": "no-store", "X-RateLimit-Remaining": String(decision.remaining) };
    if (report.verdict === "invalid") {
      return json(
        {
          error: { code: "validation_failed", message: "The specification is not valid; nothing was run.", details: report.errors },
          report,
        },
        { status: 422, headers },
      );
    }
    return json({ report }, { headers });
  } catch (e) {
    const res = errorResponse(e, "POST /api/v1/check");
    if (e instanceof CheckUnavailable) res.headers.set("Retry-After", String(e.retryAfterSeconds));
    return res;
  }
}
