// Who may open, call or post what: every page (app/**/page.tsx), every method of every route handler
// (app/**/route.ts) and every server action (exported async functions of app/** files marked
// "use server"), each with what the product answers each kind of person. The lists are checked
// against the files on disk (tests/unit/security/access-matrix-inventory.test.ts), tried over HTTP
// against the running app (tests/e2e/access-matrix.test.ts: pages and routes) and by calling the
// actions with the session replaced (tests/integration/security/action-access.test.ts).
//
// The people, always the same demo accounts (db/seed-data.ts), and what "owner" means:
//   visitor      no session
//   member       demo-builder: buys from sellerOwner, keeps the bring-up log, books the review, asks the question
//   sellerOwner  demo-seller-kits: sells the listings and the order the fixtures are about
//   sellerOther  demo-seller-magnetics: a seller too, but not of those
//   reviewer     demo-reviewer: the reviewer of the fixtures' review session
//   moderator    demo-moderator
//   admin        demo-admin (admin includes moderator, nothing else)
// Rows read in that order: row(visitor, member, sellerOwner, sellerOther, reviewer, moderator, admin).
//
// Paths name fixtures in braces; tests/support/access-fixtures.ts makes them:
//   {listingSlug}    a live kit of sellerOwner          {ownListing}   a draft of sellerOwner
//   {reviewListing}  an in-review listing of sellerOwner {missing}      a uuid of nothing
//   {order}          member's delivered order from sellerOwner, with a declined {returnRequest} and an open one
//   {checkout} / {checkoutSession}   the checkout that paid for {order}, and its payment session
//   {log}            member's private bring-up log     {review}       member's accepted review with reviewer
//   {question}       member's question, still waiting for a moderator (pending)
//   {capture}        a scope capture on a reading of {log}, which could not be measured
//   {memberId}       member's user id

export const PERSONAS = ["visitor", "member", "sellerOwner", "sellerOther", "reviewer", "moderator", "admin"] as const;
export type Persona = (typeof PERSONAS)[number];
export type SignedInPersona = Exclude<Persona, "visitor">;

export const PERSONA_USER_IDS: Record<SignedInPersona, string> = {
  member: "demo-builder",
  sellerOwner: "demo-seller-kits",
  sellerOther: "demo-seller-magnetics",
  reviewer: "demo-reviewer",
  moderator: "demo-moderator",
  admin: "demo-admin",
};

/**
 * A page: "ok" (200, no refusal shown), "ok:<text>" (200 and the text is on the page), "sign-in"
 * (the sign-in prompt instead of the content), "not-allowed" (signed in, wrong role), "not-found"
 * (404 page; also what someone gets for a thing that is not theirs), "redirect:<path>".
 */
export type PageOutcome = "ok" | "sign-in" | "not-allowed" | "not-found" | `ok:${string}` | `redirect:${string}`;
/** A route: the status, optionally with the body's `error` code ("403:forbidden"), or "redirect:<path>" for a 3xx. */
export type RouteOutcome = number | `${number}:${string}` | `redirect:${string}`;
/**
 * A server action: "ok" (done, or redirected onwards), "401" / "403" (refused by the session guard),
 * "refused" (past the guard, refused by the operation: not theirs, not in that state, already done),
 * "invalid" (past the guard, refused by input validation — used where success would be costly).
 */
export type ActionOutcome = "ok" | "401" | "403" | "refused" | "invalid";

export type Row<O> = Record<Persona, O>;

export function row<O>(visitor: O, member: O, sellerOwner: O, sellerOther: O, reviewer: O, moderator: O, admin: O): Row<O> {
  return { visitor, member, sellerOwner, sellerOther, reviewer, moderator, admin };
}
const all = <O>(o: O): Row<O> => row(o, o, o, o, o, o, o);
/** Open to everyone signed in; a visitor is asked to sign in. */
const members = <O>(o: O, visitor: O): Row<O> => row(visitor, o, o, o, o, o, o);

export type PageEntry = { kind: "page"; file: string; path: string; expect: Row<PageOutcome>; note?: string };

export type RouteEntry = {
  kind: "route";
  file: string;
  method: "GET" | "POST" | "PUT" | "PATCH" | "DELETE";
  path: string;
  /** JSON body (sent as application/json); absent: no body. */
  body?: unknown;
  expect: Row<RouteOutcome>;
  /**
   * Cells not tried over HTTP because the call changes demo data the other browser tests rely on
   * (a payout account made in the payments stand-in); tests/integration/security/route-side-effects.test.ts
   * calls the handler for them instead.
   */
  notOverHttp?: { personas: Persona[]; why: string };
  /** Routes with a check of their own instead of the session and Origin (signatures, CSRF tokens). */
  ownChecks?: string;
  note?: string;
};

export type ActionEntry = { kind: "action"; file: string; name: string; expect: Row<ActionOutcome>; note?: string };

export type MatrixEntry = PageEntry | RouteEntry | ActionEntry;

/** The key the inventory test compares with the files on disk. */
export function entryKey(e: MatrixEntry): string {
  if (e.kind === "page") return `page ${e.file}`;
  if (e.kind === "route") return `route ${e.file} ${e.method}`;
  return `action ${e.file} ${e.name}`;
}

// ─── pages ──────────────────────────────────────────────────────────────────────────────────────
const signIn = "sign-in" as const;
const na = "not-allowed" as const;
const nf = "not-found" as const;

export const PAGES: PageEntry[] = [
  // shop
  { kind: "page", file: "app/(shop)/page.tsx", path: "/", expect: all("ok") },
  { kind: "page", file: "app/(shop)/catalog/page.tsx", path: "/catalog", expect: all("ok") },
  { kind: "page", file: "app/(shop)/listings/[slug]/page.tsx", path: "/listings/{listingSlug}", expect: all("ok") },
  { kind: "page", file: "app/(shop)/cart/page.tsx", path: "/cart", expect: all("ok") },
  { kind: "page", file: "app/(shop)/checkout/page.tsx", path: "/checkout", expect: members("ok", signIn) },
  {
    kind: "page",
    file: "app/(shop)/checkout/done/page.tsx",
    path: "/checkout/done?session={checkoutSession}",
    expect: row(signIn, "ok:checkout-done", "ok:No such checkout", "ok:No such checkout", "ok:No such checkout", "ok:No such checkout", "ok:No such checkout"),
    note: "only the buyer's own checkout is shown; anyone else reads that there is none",
  },
  { kind: "page", file: "app/(shop)/orders/page.tsx", path: "/orders", expect: members("ok", signIn) },
  { kind: "page", file: "app/(shop)/orders/[id]/page.tsx", path: "/orders/{order}", expect: row(signIn, "ok", nf, nf, nf, nf, nf), note: "the buyer's page; the seller has /sell/orders/[id]" },
  // account
  { kind: "page", file: "app/(account)/account/page.tsx", path: "/account", expect: members("ok", signIn) },
  { kind: "page", file: "app/(account)/account/become-a-seller/page.tsx", path: "/account/become-a-seller", expect: members("ok", signIn) },
  { kind: "page", file: "app/(account)/sign-in/page.tsx", path: "/sign-in", expect: members("redirect:/account", "ok") },
  { kind: "page", file: "app/(account)/sign-in/check-email/page.tsx", path: "/sign-in/check-email", expect: all("ok") },
  { kind: "page", file: "app/(account)/sign-in/problem/page.tsx", path: "/sign-in/problem", expect: all("ok") },
  // bench
  { kind: "page", file: "app/(bench)/bench/(desk)/page.tsx", path: "/bench", expect: members("ok", signIn) },
  {
    kind: "page",
    file: "app/(bench)/bench/logs/[id]/page.tsx",
    path: "/bench/logs/{log}",
    expect: row(nf, "ok", nf, nf, "ok", "ok", "ok"),
    note: "a private log: its owner, the reviewer of an accepted review of it, and moderators (disputes); nobody else learns it exists",
  },
  {
    kind: "page",
    file: "app/(bench)/bench/captures/[id]/page.tsx",
    path: "/bench/captures/{capture}",
    expect: row(nf, "ok", nf, nf, "ok", "ok", "ok"),
    note: "a capture is read by whoever may read its log",
  },
  { kind: "page", file: "app/(bench)/questions/page.tsx", path: "/questions", expect: all("ok") },
  { kind: "page", file: "app/(bench)/questions/new/page.tsx", path: "/questions/new", expect: members("ok", signIn) },
  {
    kind: "page",
    file: "app/(bench)/questions/[id]/page.tsx",
    path: "/questions/{question}",
    expect: row(nf, "ok", nf, nf, nf, "ok", "ok"),
    note: "a question waiting for pre-moderation: its author and moderators only",
  },
  { kind: "page", file: "app/(bench)/reviewers/page.tsx", path: "/reviewers", expect: all("ok") },
  { kind: "page", file: "app/(bench)/reviewers/apply/page.tsx", path: "/reviewers/apply", expect: members("ok", signIn) },
  { kind: "page", file: "app/(bench)/reviews/page.tsx", path: "/reviews", expect: members("ok", signIn) },
  { kind: "page", file: "app/(bench)/reviews/new/page.tsx", path: "/reviews/new", expect: members("ok", signIn) },
  {
    kind: "page",
    file: "app/(bench)/reviews/[id]/page.tsx",
    path: "/reviews/{review}",
    expect: row(signIn, "ok", nf, nf, "ok", "ok", "ok"),
    note: "the builder, the reviewer and moderators (disputes)",
  },
  {
    kind: "page",
    file: "app/(bench)/reviews/[id]/captures/[captureId]/page.tsx",
    path: "/reviews/{review}/captures/{capture}",
    expect: row(signIn, "ok", nf, nf, "ok", "ok", "ok"),
    note: "the session's two parties and moderators, and only captures of its log",
  },
  {
    kind: "page",
    file: "app/(bench)/reviews/[id]/report/page.tsx",
    path: "/reviews/{review}/report",
    expect: row(signIn, na, na, na, "ok", na, na),
    note: "only the session's own reviewer writes the report",
  },
  { kind: "page", file: "app/(bench)/workbench/page.tsx", path: "/workbench", expect: all("ok") },
  { kind: "page", file: "app/(bench)/workbench/inductor/page.tsx", path: "/workbench/inductor", expect: all("ok") },
  { kind: "page", file: "app/(bench)/workbench/mains/page.tsx", path: "/workbench/mains", expect: all("ok") },
  { kind: "page", file: "app/(bench)/workbench/transformer/page.tsx", path: "/workbench/transformer", expect: all("ok") },
  { kind: "page", file: "app/(bench)/workbench/welding-output/page.tsx", path: "/workbench/welding-output", expect: all("ok") },
  { kind: "page", file: "app/(bench)/workbench/winding/page.tsx", path: "/workbench/winding", expect: all("ok") },
  // moderation and administration
  { kind: "page", file: "app/(moderate)/admin/fee/page.tsx", path: "/admin/fee", expect: row(signIn, na, na, na, na, na, "ok") },
  { kind: "page", file: "app/(moderate)/admin/policy/page.tsx", path: "/admin/policy", expect: row(signIn, na, na, na, na, na, "ok") },
  { kind: "page", file: "app/(moderate)/admin/users/page.tsx", path: "/admin/users", expect: row(signIn, na, na, na, na, na, "ok") },
  { kind: "page", file: "app/(moderate)/moderate/page.tsx", path: "/moderate", expect: row(signIn, na, na, na, na, "ok", "ok") },
  { kind: "page", file: "app/(moderate)/moderate/applications/page.tsx", path: "/moderate/applications", expect: row(signIn, na, na, na, na, "ok", "ok") },
  { kind: "page", file: "app/(moderate)/moderate/disputes/page.tsx", path: "/moderate/disputes", expect: row(signIn, na, na, na, na, "ok", "ok") },
  { kind: "page", file: "app/(moderate)/moderate/listings/[id]/page.tsx", path: "/moderate/listings/{reviewListing}", expect: row(signIn, na, na, na, na, "ok", "ok") },
  { kind: "page", file: "app/(moderate)/moderate/posts/page.tsx", path: "/moderate/posts", expect: row(signIn, na, na, na, na, "ok", "ok") },
  { kind: "page", file: "app/(moderate)/moderate/reviewers/page.tsx", path: "/moderate/reviewers", expect: row(signIn, na, na, na, na, "ok", "ok") },
  // selling
  { kind: "page", file: "app/(sell)/sell/page.tsx", path: "/sell", expect: row(signIn, na, "ok", "ok", na, na, na) },
  { kind: "page", file: "app/(sell)/sell/listings/new/page.tsx", path: "/sell/listings/new", expect: row(signIn, na, "ok", "ok", na, na, na) },
  { kind: "page", file: "app/(sell)/sell/listings/[id]/page.tsx", path: "/sell/listings/{ownListing}", expect: row(signIn, na, "ok", nf, na, na, na) },
  { kind: "page", file: "app/(sell)/sell/orders/page.tsx", path: "/sell/orders", expect: row(signIn, na, "ok", "ok", na, na, na) },
  { kind: "page", file: "app/(sell)/sell/orders/[id]/page.tsx", path: "/sell/orders/{order}", expect: row(signIn, na, "ok", nf, na, na, na) },
  {
    kind: "page",
    file: "app/(sell)/sell/shop/page.tsx",
    path: "/sell/shop",
    expect: row(signIn, na, "redirect:/sell", "redirect:/sell", na, na, na),
    note: "both demo sellers have a shop already, so the opening form sends them to their desk",
  },
];

// ─── route handlers ─────────────────────────────────────────────────────────────────────────────
const toSignIn = "redirect:/sign-in" as const;
const moderatorsOnly = (allowed: RouteOutcome): Row<RouteOutcome> => row(401, 403, 403, 403, 403, allowed, allowed);
const adminOnly = (allowed: RouteOutcome): Row<RouteOutcome> => row(401, 403, 403, 403, 403, 403, allowed);

export const ROUTES: RouteEntry[] = [
  // return addresses of the hosted payment pages
  {
    kind: "route",
    file: "app/(bench)/reviews/booked/route.ts",
    method: "GET",
    path: "/reviews/booked?session=cs_access_matrix_unknown",
    expect: members("redirect:/reviews", toSignIn),
    note: "a payment session that is not the person's own books nothing",
  },
  {
    kind: "route",
    file: "app/(bench)/reviews/payouts/refresh/route.ts",
    method: "GET",
    path: "/reviews/payouts/refresh",
    expect: row(toSignIn, toSignIn, toSignIn, toSignIn, "redirect:payments", toSignIn, toSignIn),
    notOverHttp: { personas: ["reviewer"], why: "makes a payout account for the demo reviewer in the payments stand-in" },
  },
  { kind: "route", file: "app/(bench)/reviews/payouts/return/route.ts", method: "GET", path: "/reviews/payouts/return", expect: row(toSignIn, toSignIn, toSignIn, toSignIn, "redirect:/reviews", toSignIn, toSignIn) },
  {
    kind: "route",
    file: "app/(sell)/sell/payouts/refresh/route.ts",
    method: "GET",
    path: "/sell/payouts/refresh",
    expect: row(toSignIn, toSignIn, "redirect:payments", "redirect:payments", toSignIn, toSignIn, toSignIn),
    notOverHttp: { personas: ["sellerOwner", "sellerOther"], why: "makes payout accounts for the demo sellers in the payments stand-in" },
  },
  { kind: "route", file: "app/(sell)/sell/payouts/return/route.ts", method: "GET", path: "/sell/payouts/return", expect: row(toSignIn, toSignIn, "redirect:/sell", "redirect:/sell", toSignIn, toSignIn, toSignIn) },
  // administration
  { kind: "route", file: "app/api/admin/policy/route.ts", method: "GET", path: "/api/admin/policy", expect: adminOnly(200) },
  { kind: "route", file: "app/api/admin/policy/route.ts", method: "POST", path: "/api/admin/policy", body: {}, expect: adminOnly(422), note: "an empty revision: the admin reaches validation, nothing is published" },
  { kind: "route", file: "app/api/admin/users/route.ts", method: "GET", path: "/api/admin/users", expect: adminOnly(200) },
  { kind: "route", file: "app/api/admin/users/[id]/roles/route.ts", method: "POST", path: "/api/admin/users/{memberId}/roles", body: {}, expect: adminOnly(422) },
  // Auth.js
  { kind: "route", file: "app/api/auth/[...nextauth]/route.ts", method: "GET", path: "/api/auth/session", expect: all(200), ownChecks: "Auth.js" },
  {
    kind: "route",
    file: "app/api/auth/[...nextauth]/route.ts",
    method: "POST",
    path: "/api/auth/signout",
    expect: all("redirect:/sign-in?error=MissingCSRF"),
    ownChecks: "Auth.js: a POST without its double-submit CSRF token is refused",
  },
  // calculators and the sheet check: public, stateless
  { kind: "route", file: "app/api/calc/inductor/route.ts", method: "POST", path: "/api/calc/inductor", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/calc/mains/route.ts", method: "POST", path: "/api/calc/mains", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/calc/transformer/route.ts", method: "POST", path: "/api/calc/transformer", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/calc/welding-output/route.ts", method: "POST", path: "/api/calc/welding-output", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/calc/winding/route.ts", method: "POST", path: "/api/calc/winding", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/policy/check/route.ts", method: "POST", path: "/api/policy/check", body: {}, expect: all(422) },
  // cart: visitors have one too (cookie)
  { kind: "route", file: "app/api/cart/route.ts", method: "GET", path: "/api/cart", expect: all(200) },
  { kind: "route", file: "app/api/cart/route.ts", method: "POST", path: "/api/cart", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/cart/route.ts", method: "PATCH", path: "/api/cart", body: {}, expect: all(422) },
  { kind: "route", file: "app/api/cart/route.ts", method: "DELETE", path: "/api/cart", body: {}, expect: all(422) },
  // scope captures ({capture} is on {log}; it failed to measure, so its trace is not there to read)
  { kind: "route", file: "app/api/captures/[id]/route.ts", method: "GET", path: "/api/captures/{capture}", expect: row(404, 200, 404, 404, 200, 200, 200) },
  {
    kind: "route",
    file: "app/api/captures/[id]/window/route.ts",
    method: "GET",
    path: "/api/captures/{capture}/window",
    expect: row(404, 409, 404, 404, 409, 409, 409),
    note: "readers of the log reach the capture (not measured: 409); anyone else meets the same 404 as for nothing",
  },
  // checkout
  {
    kind: "route",
    file: "app/api/checkout/cancel/route.ts",
    method: "GET",
    path: "/api/checkout/cancel?checkout={missing}",
    expect: all("redirect:/cart"),
    note: "only the buyer's own open checkout is closed; anything else lands on the unchanged cart",
  },
  { kind: "route", file: "app/api/checkout/status/route.ts", method: "GET", path: "/api/checkout/status?session={checkoutSession}", expect: row(401, 200, 404, 404, 404, 404, 404) },
  // public reads
  { kind: "route", file: "app/api/health/route.ts", method: "GET", path: "/api/health", expect: all(200) },
  { kind: "route", file: "app/api/session/route.ts", method: "GET", path: "/api/session", expect: all(200), note: "who the site header names; null for a visitor" },
  { kind: "route", file: "app/api/listings/route.ts", method: "GET", path: "/api/listings", expect: all(200) },
  // moderation (on an id of nothing, so a moderator passes the guard and nothing changes)
  { kind: "route", file: "app/api/moderation/applications/[id]/approve/route.ts", method: "POST", path: "/api/moderation/applications/{missing}/approve", expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/moderation/applications/[id]/decline/route.ts", method: "POST", path: "/api/moderation/applications/{missing}/decline", body: { reason: "Not a shop of parts for mains builds." }, expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/moderation/listings/[id]/approve/route.ts", method: "POST", path: "/api/moderation/listings/{missing}/approve", expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/moderation/listings/[id]/hold/route.ts", method: "POST", path: "/api/moderation/listings/{missing}/hold", body: { reason: "The stored-charge note is missing its wait time." }, expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/moderation/listings/[id]/restore/route.ts", method: "POST", path: "/api/moderation/listings/{missing}/restore", expect: moderatorsOnly(404) },
  {
    kind: "route",
    file: "app/api/moderation/listings/[id]/send-back/route.ts",
    method: "POST",
    path: "/api/moderation/listings/{missing}/send-back",
    body: { reasons: [{ topic: "stored-charge", text: "State the wait time after unplugging." }] },
    expect: moderatorsOnly(404),
  },
  { kind: "route", file: "app/api/moderation/queue/route.ts", method: "GET", path: "/api/moderation/queue", expect: moderatorsOnly(200) },
  // orders: {order} is delivered, so the seller's own calls meet the state rules (409) and change nothing
  { kind: "route", file: "app/api/orders/route.ts", method: "GET", path: "/api/orders", expect: members(200, 401) },
  { kind: "route", file: "app/api/orders/[id]/route.ts", method: "GET", path: "/api/orders/{order}", expect: row(401, 200, 200, 404, 404, 404, 404), note: "its buyer and its seller" },
  { kind: "route", file: "app/api/orders/[id]/cancel/route.ts", method: "POST", path: "/api/orders/{order}/cancel", expect: row(401, 403, 409, 404, 404, 404, 404), note: "the buyer is told it is the seller's to do" },
  { kind: "route", file: "app/api/orders/[id]/deliver/route.ts", method: "POST", path: "/api/orders/{order}/deliver", expect: row(401, 409, 409, 404, 404, 404, 404), note: "the buyer may confirm delivery too" },
  { kind: "route", file: "app/api/orders/[id]/ship/route.ts", method: "POST", path: "/api/orders/{order}/ship", body: { carrier: "Yard Post", trackingRef: "YP-MATRIX-1" }, expect: row(401, 403, 409, 404, 404, 404, 404) },
  { kind: "route", file: "app/api/orders/[id]/refunds/route.ts", method: "POST", path: "/api/orders/{order}/refunds", body: {}, expect: row(401, 403, 422, 404, 404, 404, 404) },
  {
    kind: "route",
    file: "app/api/orders/[id]/returns/route.ts",
    method: "POST",
    path: "/api/orders/{order}/returns",
    body: { reason: "The transformer arrived with a cracked bobbin." },
    expect: row(401, 409, 403, 404, 404, 404, 404),
    note: "the buyer asks for a return; {order} has one open already, so nothing is written",
  },
  { kind: "route", file: "app/api/orders/[id]/returns/[returnId]/accept/route.ts", method: "POST", path: "/api/orders/{order}/returns/{returnRequest}/accept", expect: row(401, 403, 409, 404, 404, 404, 404) },
  {
    kind: "route",
    file: "app/api/orders/[id]/returns/[returnId]/decline/route.ts",
    method: "POST",
    path: "/api/orders/{order}/returns/{returnRequest}/decline",
    body: { reason: "The board has been soldered and cannot go back." },
    expect: row(401, 403, 409, 404, 404, 404, 404),
  },
  { kind: "route", file: "app/api/payouts/status/route.ts", method: "GET", path: "/api/payouts/status", expect: row(401, 403, 200, 200, 403, 403, 403) },
  // Q&A ({question} is pending: only its author and moderators can see it)
  { kind: "route", file: "app/api/posts/[kind]/[id]/approve/route.ts", method: "POST", path: "/api/posts/question/{missing}/approve", expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/posts/[kind]/[id]/remove/route.ts", method: "POST", path: "/api/posts/question/{missing}/remove", body: { reason: "Off topic for the bench." }, expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/posts/[kind]/[id]/restore/route.ts", method: "POST", path: "/api/posts/question/{missing}/restore", expect: moderatorsOnly(404) },
  { kind: "route", file: "app/api/posts/[kind]/[id]/flag/route.ts", method: "POST", path: "/api/posts/question/{question}/flag", body: { reason: "Asks how to bypass the bleeder." }, expect: row(401, 403, 404, 404, 404, 409, 409), note: "not one's own post; a post still waiting for a moderator cannot be flagged" },
  { kind: "route", file: "app/api/posts/[kind]/[id]/vote/route.ts", method: "POST", path: "/api/posts/answer/{missing}/vote", body: { value: 1 }, expect: members(404, 401) },
  { kind: "route", file: "app/api/posts/queue/route.ts", method: "GET", path: "/api/posts/queue", expect: moderatorsOnly(200) },
  { kind: "route", file: "app/api/questions/route.ts", method: "GET", path: "/api/questions", expect: all(200) },
  { kind: "route", file: "app/api/questions/route.ts", method: "POST", path: "/api/questions", body: {}, expect: members(422, 401) },
  { kind: "route", file: "app/api/questions/[id]/route.ts", method: "GET", path: "/api/questions/{question}", expect: row(404, 200, 404, 404, 404, 200, 200) },
  {
    kind: "route",
    file: "app/api/questions/[id]/answers/route.ts",
    method: "POST",
    path: "/api/questions/{question}/answers",
    body: {},
    expect: members(422, 401),
    note: "the body is checked before the question is looked up, so an empty one tells nobody whether it exists; who may answer a pending question is tried with answerAction",
  },
  { kind: "route", file: "app/api/questions/[id]/accept/route.ts", method: "POST", path: "/api/questions/{question}/accept", body: { answerId: null }, expect: row(401, 409, 404, 404, 404, 403, 403), note: "the author only, and not while the question waits for a moderator" },
  // the seller desk
  { kind: "route", file: "app/api/sell/listings/[id]/stock/route.ts", method: "PATCH", path: "/api/sell/listings/{ownListing}/stock", body: { stock: 3 }, expect: row(401, 403, 200, 404, 403, 403, 403), note: "3 is the fixture's stock already" },
  // uploads (the SDK's handler; the file routes' middleware is the session guard)
  { kind: "route", file: "app/api/uploadthing/route.ts", method: "GET", path: "/api/uploadthing", expect: all(200), ownChecks: "uploadthing: the route config is public" },
  {
    kind: "route",
    file: "app/api/uploadthing/route.ts",
    method: "POST",
    path: "/api/uploadthing?actionType=upload&slug=listingPhoto",
    body: { files: [{ name: "board.png", size: 2048, type: "image/png", lastModified: 0 }] },
    expect: row(403, 403, 200, 200, 403, 403, 403),
    ownChecks: "uploadthing: callbacks are signed; upload requests go through the file route's session guard",
  },
  // payment provider
  { kind: "route", file: "app/api/webhooks/payments/route.ts", method: "POST", path: "/api/webhooks/payments", body: {}, expect: all(400), ownChecks: "the provider's signature" },
];

// ─── server actions ─────────────────────────────────────────────────────────────────────────────
const a401 = "401" as const;
const a403 = "403" as const;
const ref = "refused" as const;
const sellersOwn = row<ActionOutcome>(a401, a403, "ok", ref, a403, a403, a403);
const moderatorsAct = (o: ActionOutcome) => row<ActionOutcome>(a401, a403, a403, a403, a403, o, o);

export const ACTIONS: ActionEntry[] = [
  // account
  { kind: "action", file: "app/(account)/account/become-a-seller/actions.ts", name: "applyToSell", expect: row(a401, "ok", ref, ref, "ok", "ok", "ok"), note: "sellers have a shop already" },
  { kind: "action", file: "app/(account)/sign-in/actions.ts", name: "requestSignInLink", expect: all("ok") },
  { kind: "action", file: "app/(account)/sign-in/actions.ts", name: "signOutAction", expect: all("ok") },
  // bench
  { kind: "action", file: "app/(bench)/bench/actions.ts", name: "createLogAction", expect: members("ok", a401), note: "a log of one's own build; anyone signed in may keep one" },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/actions.ts", name: "recordReadingAction", expect: row(a401, "ok", ref, ref, ref, ref, ref), note: "the log's owner only" },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/actions.ts", name: "addCheckpointAction", expect: row(a401, "ok", ref, ref, ref, ref, ref) },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/actions.ts", name: "setVisibilityAction", expect: row(a401, "ok", ref, ref, ref, ref, ref) },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/capture-actions.ts", name: "attachCaptureAction", expect: row(a401, "ok", ref, ref, ref, ref, ref), note: "each person attaching a capture file of their own to member's reading" },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/capture-actions.ts", name: "confirmProposalAction", expect: row(a401, "ok", ref, ref, ref, ref, ref) },
  { kind: "action", file: "app/(bench)/bench/logs/[id]/capture-actions.ts", name: "removeCaptureAction", expect: row(a401, "ok", ref, ref, ref, ref, ref) },
  { kind: "action", file: "app/(bench)/questions/actions.ts", name: "askQuestionAction", expect: members("ok", a401) },
  { kind: "action", file: "app/(bench)/questions/[id]/actions.ts", name: "answerAction", expect: members("ok", a401) },
  { kind: "action", file: "app/(bench)/questions/[id]/actions.ts", name: "flagAction", expect: row(a401, ref, "ok", "ok", "ok", "ok", "ok"), note: "not one's own post" },
  { kind: "action", file: "app/(bench)/questions/[id]/actions.ts", name: "voteAction", expect: row(a401, "ok", ref, "ok", "ok", "ok", "ok"), note: "the answer is sellerOwner's: no vote on one's own" },
  { kind: "action", file: "app/(bench)/questions/[id]/actions.ts", name: "acceptAction", expect: row(a401, "ok", ref, ref, ref, ref, ref), note: "the question's author only" },
  { kind: "action", file: "app/(bench)/reviewers/apply/actions.ts", name: "applyToReview", expect: row(a401, "ok", "ok", "ok", ref, "ok", "ok"), note: "the reviewer is one already" },
  // reviews
  { kind: "action", file: "app/(bench)/reviews/actions.ts", name: "connectReviewerPayout", expect: row(a401, a403, a403, a403, "ok", a403, a403) },
  { kind: "action", file: "app/(bench)/reviews/actions.ts", name: "changeAvailability", expect: row(a401, a403, a403, a403, "ok", a403, a403) },
  { kind: "action", file: "app/(bench)/reviews/new/actions.ts", name: "bookReview", expect: row(a401, "ok", ref, ref, ref, ref, ref), note: "a review of one's own log only" },
  { kind: "action", file: "app/(bench)/reviews/[id]/actions.ts", name: "acceptAction", expect: row(a401, a403, a403, a403, "ok", a403, a403), note: "the session's reviewer" },
  { kind: "action", file: "app/(bench)/reviews/[id]/actions.ts", name: "declineAction", expect: row(a401, a403, a403, a403, "ok", a403, a403) },
  { kind: "action", file: "app/(bench)/reviews/[id]/actions.ts", name: "disputeAction", expect: row(a401, "ok", ref, ref, ref, ref, ref), note: "the builder disputes a delivered report" },
  { kind: "action", file: "app/(bench)/reviews/[id]/report/actions.ts", name: "deliverReportAction", expect: row(a401, a403, a403, a403, "ok", a403, a403) },
  {
    kind: "action",
    file: "app/(bench)/reviews/[id]/captures/[captureId]/actions.ts",
    name: "addPinAction",
    expect: row(a401, ref, ref, ref, "ok", ref, ref),
    note: "the session's reviewer pins; the builder and moderators read the pins",
  },
  // administration and moderation
  { kind: "action", file: "app/(moderate)/admin/fee/actions.ts", name: "setPlatformFeeAction", expect: row(a401, a403, a403, a403, a403, a403, "ok") },
  {
    kind: "action",
    file: "app/(moderate)/admin/policy/actions.ts",
    name: "publishPolicyAction",
    expect: row(a401, a403, a403, a403, a403, a403, "invalid"),
    note: "an incomplete revision: publishing re-checks every live listing, so the admin's call stops at validation",
  },
  { kind: "action", file: "app/(moderate)/moderate/applications/actions.ts", name: "approveApplicationAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/applications/actions.ts", name: "declineApplicationAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/disputes/actions.ts", name: "settleDisputeAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/listings/[id]/actions.ts", name: "approveListingAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/listings/[id]/actions.ts", name: "sendBackListingAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/listings/[id]/actions.ts", name: "holdListingAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/listings/[id]/actions.ts", name: "restoreListingAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/posts/actions.ts", name: "approvePostAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/posts/actions.ts", name: "removePostAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/posts/actions.ts", name: "restorePostAction", expect: moderatorsAct("ok"), note: "a post its flags hid" },
  { kind: "action", file: "app/(moderate)/moderate/reviewers/actions.ts", name: "approveReviewerAction", expect: moderatorsAct("ok") },
  { kind: "action", file: "app/(moderate)/moderate/reviewers/actions.ts", name: "declineReviewerAction", expect: moderatorsAct("ok") },
  // selling
  { kind: "action", file: "app/(sell)/sell/actions.ts", name: "connectPayoutAccount", expect: row(a401, a403, "ok", "ok", a403, a403, a403) },
  { kind: "action", file: "app/(sell)/sell/listings/actions.ts", name: "saveListing", expect: sellersOwn, note: "saving sellerOwner's draft" },
  { kind: "action", file: "app/(sell)/sell/listings/actions.ts", name: "retireListingAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "shipOrderAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "markDeliveredAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "cancelOrderAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "refundLineAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "acceptReturnAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/orders/actions.ts", name: "declineReturnAction", expect: sellersOwn },
  { kind: "action", file: "app/(sell)/sell/shop/actions.ts", name: "openShop", expect: row(a401, a403, ref, ref, a403, a403, a403), note: "both demo sellers have their shop open" },
  // shop
  { kind: "action", file: "app/(shop)/cart/actions.ts", name: "addToCartAction", expect: all("ok") },
  { kind: "action", file: "app/(shop)/cart/actions.ts", name: "updateCartLineAction", expect: all("ok") },
  { kind: "action", file: "app/(shop)/cart/actions.ts", name: "removeCartLineAction", expect: all("ok") },
  { kind: "action", file: "app/(shop)/checkout/actions.ts", name: "startCheckoutAction", expect: members("ok", a401) },
  { kind: "action", file: "app/(shop)/orders/actions.ts", name: "confirmDeliveryAction", expect: row(a401, "ok", "ok", ref, ref, ref, ref), note: "the buyer, or the seller on the buyer's word" },
  { kind: "action", file: "app/(shop)/orders/actions.ts", name: "requestReturnAction", expect: row(a401, "ok", ref, ref, ref, ref, ref) },
];

export const MATRIX: MatrixEntry[] = [...PAGES, ...ROUTES, ...ACTIONS];

/** A path with its fixtures filled in. */
export function fillPath(path: string, fixtures: Record<string, string>): string {
  return path.replace(/\{(\w+)\}/g, (_, name: string) => {
    const value = fixtures[name];
    if (value === undefined) throw new Error(`the access matrix names a fixture {${name}} that the test did not make`);
    return encodeURIComponent(value);
  });
}
