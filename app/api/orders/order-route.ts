import "server-only";
import type { z } from "zod";
import { OrderError, type RefundOutcome } from "@/db/queries/orders";
import { guardRoute } from "@/lib/auth/guard";
import type { SessionUser } from "@/lib/auth/access";
import { fieldErrorsFromZod, invalidInput, jsonError, readOptionalJson } from "@/lib/http/json";

// The shape every POST under /api/orders/[id]/… shares: 401 from the session guard, then the body
// (an empty body is `{}`), then the domain call, whose OrderError becomes 403/404/409/422.

const MAX_BODY_BYTES = 16 * 1024;
const CODES: Record<number, string> = { 403: "forbidden", 404: "not_found", 409: "conflict", 422: "invalid_input" };

export type OrderRouteParams = { id: string; returnId?: string };

// The shared reader also refuses a request another site made the browser send (Origin, Content-Type).
const readBody = (request: Request) => readOptionalJson(request, { maxBytes: MAX_BODY_BYTES });

export function parseWith<S extends z.ZodType>(schema: S, body: unknown): { ok: true; data: z.output<S> } | { ok: false; response: Response } {
  const parsed = schema.safeParse(body);
  if (parsed.success) return { ok: true, data: parsed.data };
  return { ok: false, response: invalidInput(parsed.error.issues[0]?.message ?? "Some inputs are missing.", fieldErrorsFromZod(parsed.error)) };
}

export function orderRoute(act: (input: { body: unknown; user: SessionUser; params: OrderRouteParams }) => Promise<Response>, route: string) {
  return guardRoute<OrderRouteParams>(undefined, async (request, user, { params }) => {
    const read = await readBody(request);
    if (!read.ok) return read.response;
    try {
      return await act({ body: read.body, user, params: await params });
    } catch (error) {
      if (error instanceof OrderError) return jsonError(error.status, CODES[error.status] ?? "error", error.message, error.field ? { [error.field]: [error.message] } : undefined);
      console.error(`[orders/${route}]`, error);
      return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
    }
  });
}

/** 200 once the money has moved, 202 while the payment service has not answered, 409 if it refused. */
export function refundResponse(outcomes: RefundOutcome[], extra: Record<string, unknown> = {}): Response {
  const failed = outcomes.find((o) => o.status === "failed");
  const pending = outcomes.some((o) => o.status === "pending");
  if (failed && !pending && outcomes.every((o) => o.status === "failed")) {
    return Response.json({ error: "payment_refused", message: failed.message ?? "The payment service refused the refund.", refunds: outcomes, ...extra }, { status: 409 });
  }
  return Response.json({ ok: true, refunds: outcomes, ...extra }, { status: pending || failed ? 202 : 200 });
}
