import "server-only";
import { guardRoute } from "@/lib/auth/guard";
import type { SessionUser } from "@/lib/auth/access";
import type { Role } from "@/db/schema/users";
import { jsonError } from "@/lib/http/json";
import { readOptionalJson } from "@/lib/http/json";
import type { QaOutcome } from "./outcome";
import { outcomeJson } from "./outcome-json";

type Params = Record<string, string>;

/**
 * A member's POST to the Q&A: 401/403 from the session guard, the optional JSON body, then the
 * operation's own 404/409/422/429; anything unexpected is logged and answered 500.
 */
export function qaPostRoute<P extends Params>(
  name: string,
  operation: (user: SessionUser, params: P, body: unknown) => Promise<QaOutcome<object>>,
  { roles, successStatus = 200 }: { roles?: readonly Role[]; successStatus?: number } = {},
) {
  return guardRoute<P>(roles, async (request, user, { params }) => {
    const read = await readOptionalJson(request);
    if (!read.ok) return read.response;
    try {
      return outcomeJson(await operation(user, await params, read.body), successStatus);
    } catch (error) {
      console.error(`[qa/${name}]`, error);
      return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
    }
  });
}
