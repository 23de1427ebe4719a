// Public: the live safety-sheet check beside the listing form. Shapes: lib/validations/policy.ts.
import { invalidInput, handleJsonPost } from "@/lib/http/json";
import { CURRENT_POLICY_REVISION, checkSafetySheet, getPolicyRevision } from "@/lib/policy";
import { policyCheckRequestSchema } from "@/lib/validations/policy";

export async function POST(request: Request): Promise<Response> {
  return handleJsonPost(
    request,
    policyCheckRequestSchema,
    ({ declaration, notes, revision }) => {
      const policy = revision === undefined ? CURRENT_POLICY_REVISION : getPolicyRevision(revision);
      if (!policy) {
        const message = `There is no policy revision ${revision}; the current one is ${CURRENT_POLICY_REVISION.revision}.`;
        return invalidInput(message, { revision: [message] });
      }
      return checkSafetySheet({ declaration, notes, revision: policy });
    },
    // The policy only throws on declaration figures, so its field names live under "declaration".
    { route: "api/policy/check", fieldPrefix: "declaration." },
  );
}
