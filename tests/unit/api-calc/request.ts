/** A POST as Next's router would hand it to a route handler. */
export function postJson(body: unknown, path = "/api/calc"): Request {
  return new Request(`http://localhost:3000${path}`, {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: typeof body === "string" ? body : JSON.stringify(body),
  });
}

export async function call(
  handler: (request: Request) => Promise<Response>,
  body: unknown,
): Promise<{ status: number; json: any }> {
  const response = await handler(postJson(body));
  return { status: response.status, json: await response.json() };
}
