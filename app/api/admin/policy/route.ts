import { publishedPolicyRevisions } from "@/db/queries/moderation";
import { currentPolicyRevision } from "@/db/queries/policy";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";
import { readOptionalJson } from "@/lib/http/json";
import { publishPolicyRevision } from "@/lib/moderation/publish-policy";
import { revalidateAllListingPages } from "@/lib/listings/listing-pages";

export const dynamic = "force-dynamic";

/** GET /api/admin/policy → { current, published: [...] } */
export const GET = guardRoute(["admin"], async () => {
  const [current, published] = await Promise.all([currentPolicyRevision(), publishedPolicyRevisions()]);
  return Response.json({ current, published });
});

/**
 * POST /api/admin/policy { summary, minWords, topicMinWords: { [topic]: n }, safeVoltageV,
 * storedChargeThresholdMicroC, waitMarginFactor, graceDays } → 201 { revision }; 422 with fieldErrors.
 */
export const POST = guardRoute(["admin"], async (request, user) => {
  const read = await readOptionalJson(request);
  if (!read.ok) return read.response;
  try {
    const outcome = await publishPolicyRevision(user, read.body);
    if (!outcome.ok) return jsonError(outcome.status, outcome.status === 403 ? "forbidden" : "invalid_input", outcome.message, outcome.fieldErrors);
    revalidateAllListingPages();
    return Response.json({ revision: outcome.revision }, { status: 201 });
  } catch (error) {
    console.error("[admin/policy]", error);
    return jsonError(500, "internal_error", "The revision could not be published. Nothing was changed.");
  }
});
