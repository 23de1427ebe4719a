/** A refusal of an order action that the person can understand: 403/404/409/422, with the field it is about. */
export class OrderError extends Error {
  constructor(
    readonly status: 403 | 404 | 409 | 422,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = "OrderError";
  }
}
