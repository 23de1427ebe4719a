// The cart's limits without its schemas: client forms import these, and importing ./cart.ts
// would put all of Zod on the listing and cart pages.

/** A buyer may ask for at most this many of one item; stock caps it further. */
export const MAX_LINE_QUANTITY = 99;
