import { getJobRecord } from "@/db/queries/jobs-core";
import { jobIdForToken, paperCheck, publicVerification } from "@/db/queries/records";
import { publicRoute } from "@/lib/api/route";
import { can } from "@/lib/authz";
import { AppError } from "@/lib/errors";
import { clientAddress, limitOrThrow } from "@/lib/rate-limit";
import { verifyQuerySchema } from "@/lib/records/schemas";
import { isVerifyToken } from "@/lib/records/token";

export const dynamic = "force-dynamic";

// Anyone with the traveller's code sees whether the record is intact and, given the seal printed on the paper
// (?seal=, which the QR carries), whether the paper and the record agree; a member of the shop also gets the record.
export const GET = publicRoute({}, async ({ req, params, ctx, query }) => {
  await limitOrThrow("verify", clientAddress(req.headers), { max: 60, windowSeconds: 60 });
  const parsed = verifyQuerySchema.safeParse({ seal: query.get("seal") || undefined });
  if (!parsed.success) throw new AppError("bad_request", parsed.error.issues[0]?.message ?? "That seal cannot be read.", { seal: parsed.error.issues.map((i) => i.message) });
  const token = typeof params.token === "string" ? params.token : "";
  const found = isVerifyToken(token) ? await jobIdForToken(token) : null;
  if (!found) throw new AppError("not_found", "No record carries that code. Check it against the traveller.");
  const { shopId, integrityDetail, ...answer } = await publicVerification(found.jobId);
  const principal = await ctx.principal(shopId);
  const member = principal && principal.shopId === shopId && can(principal.roles, "job:read");
  const body: Record<string, unknown> = { ...answer };
  if (!answer.integrity.intact) body.integrity = { ...answer.integrity, firstBrokenEntry: integrityDetail.firstBrokenSeq ?? null, reason: integrityDetail.reason ?? null };
  if (parsed.data.seal) body.paper = paperCheck(integrityDetail, parsed.data.seal);
  if (member) body.job = await getJobRecord(principal, found.jobId);
  return Response.json(body, { headers: { "Cache-Control": "no-store" } });
});
