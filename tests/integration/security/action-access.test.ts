// Every server action of the access matrix (tests/support/access-matrix.ts), called as each kind of
// person with fresh rows in the state the action needs, against the real PostgreSQL and the payments
// stand-in. Only the session is replaced (Auth.js's auth(), read by the real guard, which still
// loads the person's roles from the database), with what a Next request would otherwise provide
// (cookies, revalidation). Server actions are public POST endpoints: the page that shows the
// button is no protection, so each one must refuse on its own.
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { ACTIONS, entryKey, PERSONA_USER_IDS, PERSONAS, type Persona } from "../../support/access-matrix";
import { CAPTURE_ACTION_FILES, outcomeOf } from "./action-outcome";
import {
  answer,
  deliveredOrder,
  listing,
  memberLog,
  orderWithOpenReturn,
  paidOrder,
  question,
  reviewSession,
  reviewerApplication,
  sellerApplication,
  shippedOrder,
  startActionWorld,
  type ActionWorld,
} from "./action-world";

const state = vi.hoisted(() => ({ userId: null as string | null, cookies: new Map<string, string>() }));
vi.mock("@/lib/auth/config", () => ({
  auth: async () => (state.userId ? { user: { id: state.userId } } : null),
  // The sign-in action's mail and the sign-out's cookie are Auth.js's; their access is the action's own.
  signIn: async () => undefined,
  signOut: async () => undefined,
}));
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {}, updateTag: () => {} }));
vi.mock("next/headers", () => ({
  headers: async () => new Headers(),
  cookies: async () => ({
    get: (name: string) => (state.cookies.has(name) ? { name, value: state.cookies.get(name)! } : undefined),
    set: (name: string, value: string) => void state.cookies.set(name, value),
    delete: (name: string) => void state.cookies.delete(name),
  }),
}));

let w: ActionWorld;

beforeAll(async () => {
  w = await startActionWorld();
}, 120_000);

afterAll(async () => {
  await w?.close();
});

const form = (fields: Record<string, string | string[]>) => {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) for (const item of Array.isArray(v) ? v : [v]) f.append(k, item);
  return f;
};
const shop = () =>
  form({ shopName: "Invented Bench Parts", profileMd: "Chokes and boards for bench supplies, measured before they ship.", country: "NL", returnsPolicyMd: "Unused parts within 14 days, in their bags.", returnsWindowDays: "14" });

type Call = (persona: Persona) => Promise<unknown>;
const mod = <T,>(path: string): Promise<T> => import(/* @vite-ignore */ path);
type Actions = Record<string, (...args: never[]) => Promise<unknown>>;
const act = async (file: string, name: string, ...args: unknown[]) => {
  const m = await mod<Actions>(`@/${file}`);
  return (m[name] as unknown as (...a: unknown[]) => Promise<unknown>)(...args);
};

const ACCOUNT = "app/(account)/account/become-a-seller/actions.ts";
const SIGN_IN = "app/(account)/sign-in/actions.ts";
const BENCH = "app/(bench)/bench/actions.ts";
const LOG = "app/(bench)/bench/logs/[id]/actions.ts";
const ASK = "app/(bench)/questions/actions.ts";
const QUESTION = "app/(bench)/questions/[id]/actions.ts";
const APPLY = "app/(bench)/reviewers/apply/actions.ts";
const REVIEWS = "app/(bench)/reviews/actions.ts";
const BOOK = "app/(bench)/reviews/new/actions.ts";
const SESSION = "app/(bench)/reviews/[id]/actions.ts";
const REPORT = "app/(bench)/reviews/[id]/report/actions.ts";
const FEE = "app/(moderate)/admin/fee/actions.ts";
const POLICY = "app/(moderate)/admin/policy/actions.ts";
const APPLICATIONS = "app/(moderate)/moderate/applications/actions.ts";
const DISPUTES = "app/(moderate)/moderate/disputes/actions.ts";
const MODERATE_LISTING = "app/(moderate)/moderate/listings/[id]/actions.ts";
const POSTS = "app/(moderate)/moderate/posts/actions.ts";
const VETTING = "app/(moderate)/moderate/reviewers/actions.ts";
const SELL = "app/(sell)/sell/actions.ts";
const LISTINGS = "app/(sell)/sell/listings/actions.ts";
const SELLER_ORDERS = "app/(sell)/sell/orders/actions.ts";
const SHOP = "app/(sell)/sell/shop/actions.ts";
const CART = "app/(shop)/cart/actions.ts";
const CHECKOUT = "app/(shop)/checkout/actions.ts";
const BUYER_ORDERS = "app/(shop)/orders/actions.ts";

/** The listing form's body for sellerOwner's draft (a kit with its safety sheet). */
async function listingBody() {
  const { KIT_DECLARATION, kitNotes } = await import("../selling/setup");
  return {
    kind: "kit",
    title: "Half-bridge stick welder kit, revised",
    descriptionMd: "Board, BOM and build notes.",
    price: "189.00",
    currency: "EUR",
    stock: 4,
    shippingWeightG: 1800,
    photos: [],
    documents: [],
    declaration: KIT_DECLARATION,
    notes: kitNotes(),
    checkpoints: [{ stage: "series-lamp", name: "Bus through the lamp", measure: "DC bus across C1", unit: "V", expectedMin: 300, expectedMax: 340 }],
    requirements: [],
  };
}

/** Each action, called once for one person, with fresh rows. */
const CALLS: Record<string, Call> = {
  [`${ACCOUNT} applyToSell`]: () => act(ACCOUNT, "applyToSell", null, shop()),
  [`${SIGN_IN} requestSignInLink`]: () => act(SIGN_IN, "requestSignInLink", null, form({ email: "noor.builds@larkspur.test" })),
  [`${SIGN_IN} signOutAction`]: () => act(SIGN_IN, "signOutAction"),
  [`${BENCH} createLogAction`]: () => act(BENCH, "createLogAction", { kitListingId: "", title: "A bench supply of my own" }),
  [`${LOG} recordReadingAction`]: async () => {
    const log = await memberLog(w);
    return act(LOG, "recordReadingAction", log.logId, { checkpointId: log.checkpoints[0]!.id, value: "40.2", unit: "kHz" });
  },
  [`${LOG} addCheckpointAction`]: async () =>
    act(LOG, "addCheckpointAction", (await memberLog(w)).logId, { stage: "series-lamp", name: "Lamp current", measure: "Current through the series lamp at idle", unit: "A", expectedMin: "0.1", expectedMax: "0.3" }),
  [`${LOG} setVisibilityAction`]: async () => act(LOG, "setVisibilityAction", (await memberLog(w)).logId, "public"),
  [`${ASK} askQuestionAction`]: () => act(ASK, "askQuestionAction", null, form({ title: "Bus reads 20 V low through the series lamp", bodyMd: "With a 100 W lamp in series the bus settles at 305 V DC instead of about 325 V. Is that expected?" })),
  [`${QUESTION} answerAction`]: async () => {
    const id = await question(w, "visible");
    return act(QUESTION, "answerAction", id, null, form({ bodyMd: "Yes: the lamp drops some voltage while the bus capacitors draw current. Check the idle input current next." }));
  },
  [`${QUESTION} flagAction`]: async () => {
    const id = await question(w, "visible");
    return act(QUESTION, "flagAction", "question", id, id, null, form({ reason: "Suggests bridging the bleeder resistor to save time." }));
  },
  [`${QUESTION} voteAction`]: async () => {
    const id = await question(w, "visible");
    return act(QUESTION, "voteAction", await answer(w, id, PERSONA_USER_IDS.sellerOwner), id, null, form({ value: "1" }));
  },
  [`${QUESTION} acceptAction`]: async () => {
    const id = await question(w, "visible");
    return act(QUESTION, "acceptAction", id, await answer(w, id, PERSONA_USER_IDS.sellerOwner), null);
  },
  [`${APPLY} applyToReview`]: () =>
    act(
      APPLY,
      "applyToReview",
      null,
      form({
        expertise: ["bench-supplies", "thermal"],
        profileMd: "I bring up bench supplies at the yard, slowly, with a lamp and a meter.",
        trackRecordMd: "Six bench supplies and two chargers brought up; ripple, idle current and bleeder discharge measured on each before anyone used them.",
        price: "30.00",
      }),
    ),
  [`${REVIEWS} connectReviewerPayout`]: () => act(REVIEWS, "connectReviewerPayout", null, form({})),
  [`${REVIEWS} changeAvailability`]: () => act(REVIEWS, "changeAvailability", null, form({ available: "yes" })),
  [`${BOOK} bookReview`]: async () => act(BOOK, "bookReview", null, form({ logId: (await memberLog(w)).logId, reviewerId: PERSONA_USER_IDS.reviewer, stages: ["series-lamp"], message: "" })),
  [`${SESSION} acceptAction`]: async () => act(SESSION, "acceptAction", (await reviewSession(w, "requested")).sessionId, null, form({})),
  [`${SESSION} declineAction`]: async () => act(SESSION, "declineAction", (await reviewSession(w, "requested")).sessionId, null, form({ reason: "" })),
  [`${SESSION} disputeAction`]: async () =>
    act(SESSION, "disputeAction", (await reviewSession(w, "delivered")).sessionId, null, form({ reason: "The report skips the idle current I asked about." })),
  [`${REPORT} deliverReportAction`]: async () => {
    const { sessionId, checkpoints } = await reviewSession(w, "accepted");
    const fields: Record<string, string | string[]> = { checkpoint: checkpoints.map((c) => c.id), summaryMd: "The series-lamp stage reads as it should; the bus settles where the kit says it will." };
    for (const c of checkpoints) fields[`verdict.${c.id}`] = "fine";
    return act(REPORT, "deliverReportAction", sessionId, null, form(fields));
  },
  [`${FEE} setPlatformFeeAction`]: () => act(FEE, "setPlatformFeeAction", null, form({ percent: "8" })),
  [`${POLICY} publishPolicyAction`]: () => act(POLICY, "publishPolicyAction", null, form({ summary: "" })),
  [`${APPLICATIONS} approveApplicationAction`]: async () => act(APPLICATIONS, "approveApplicationAction", await sellerApplication(w), null, form({})),
  [`${APPLICATIONS} declineApplicationAction`]: async () => act(APPLICATIONS, "declineApplicationAction", await sellerApplication(w), null, form({ reason: "We take parts for mains builds only." })),
  [`${DISPUTES} settleDisputeAction`]: async () =>
    act(DISPUTES, "settleDisputeAction", (await reviewSession(w, "disputed")).sessionId, null, form({ outcome: "payment_stands", amount: "", note: "The report covers the stage that was booked." })),
  [`${MODERATE_LISTING} approveListingAction`]: async () => act(MODERATE_LISTING, "approveListingAction", await listing(w, "in_review"), null, form({ note: "Sheet reads well." })),
  [`${MODERATE_LISTING} sendBackListingAction`]: async () =>
    act(MODERATE_LISTING, "sendBackListingAction", await listing(w, "in_review"), null, form({ reasonTopic: "stored-charge", reasonText: "State the wait time after unplugging, in seconds." })),
  [`${MODERATE_LISTING} holdListingAction`]: async () => act(MODERATE_LISTING, "holdListingAction", await listing(w, "live"), null, form({ reason: "A buyer reports the heatsink is live and unlabelled." })),
  [`${MODERATE_LISTING} restoreListingAction`]: async () => act(MODERATE_LISTING, "restoreListingAction", await listing(w, "held"), null, form({ note: "The label is on the photos now." })),
  [`${POSTS} approvePostAction`]: async () => act(POSTS, "approvePostAction", "question", await question(w, "pending"), null),
  [`${POSTS} removePostAction`]: async () => act(POSTS, "removePostAction", "question", await question(w, "visible"), null, form({ reason: "Advice that would leave the bus charged." })),
  [`${POSTS} restorePostAction`]: async () => act(POSTS, "restorePostAction", "question", await question(w, "hidden"), null),
  [`${VETTING} approveReviewerAction`]: async () => act(VETTING, "approveReviewerAction", await reviewerApplication(w), null, form({})),
  [`${VETTING} declineReviewerAction`]: async () => act(VETTING, "declineReviewerAction", await reviewerApplication(w), null, form({ reason: "Tell us more about the builds you brought up." })),
  [`${SELL} connectPayoutAccount`]: () => act(SELL, "connectPayoutAccount", null, form({})),
  [`${LISTINGS} saveListing`]: async () => act(LISTINGS, "saveListing", await listing(w, "draft"), await listingBody(), "draft"),
  [`${LISTINGS} retireListingAction`]: async () => act(LISTINGS, "retireListingAction", await listing(w, "live")),
  [`${SELLER_ORDERS} shipOrderAction`]: async () => act(SELLER_ORDERS, "shipOrderAction", (await paidOrder(w)).orderId, null, form({ carrier: "Yard Post", trackingRef: "YP-ACCESS-1" })),
  [`${SELLER_ORDERS} markDeliveredAction`]: async () => act(SELLER_ORDERS, "markDeliveredAction", (await shippedOrder(w)).orderId),
  [`${SELLER_ORDERS} cancelOrderAction`]: async () => act(SELLER_ORDERS, "cancelOrderAction", (await paidOrder(w)).orderId, "EUR"),
  [`${SELLER_ORDERS} refundLineAction`]: async () => {
    const order = await paidOrder(w);
    return act(SELLER_ORDERS, "refundLineAction", order.orderId, null, form({ lineId: order.lineIds[0]!, amount: "5.00", reason: "A bent header pin." }));
  },
  [`${SELLER_ORDERS} acceptReturnAction`]: async () => {
    const order = await orderWithOpenReturn(w);
    return act(SELLER_ORDERS, "acceptReturnAction", order.orderId, order.returnId, "EUR");
  },
  [`${SELLER_ORDERS} declineReturnAction`]: async () => {
    const order = await orderWithOpenReturn(w);
    return act(SELLER_ORDERS, "declineReturnAction", order.orderId, order.returnId, null, form({ reason: "The board has been soldered and cannot go back." }));
  },
  [`${SHOP} openShop`]: () => act(SHOP, "openShop", null, shop()),
  [`${CART} addToCartAction`]: async () => act(CART, "addToCartAction", null, form({ listingId: await listing(w, "live"), quantity: "1" })),
  [`${CART} updateCartLineAction`]: async () => {
    const id = await listing(w, "live");
    await act(CART, "addToCartAction", null, form({ listingId: id, quantity: "1" }));
    return act(CART, "updateCartLineAction", null, form({ listingId: id, quantity: "2" }));
  },
  [`${CART} removeCartLineAction`]: async () => {
    const id = await listing(w, "live");
    await act(CART, "addToCartAction", null, form({ listingId: id, quantity: "1" }));
    return act(CART, "removeCartLineAction", form({ listingId: id }));
  },
  [`${CHECKOUT} startCheckoutAction`]: async (persona) => {
    const id = await listing(w, "live");
    if (persona !== "visitor") {
      await w.pool.query("delete from cart_items where cart_id in (select id from carts where user_id = $1)", [state.userId]);
      await act(CART, "addToCartAction", null, form({ listingId: id, quantity: "1" }));
    }
    const { rows } = await w.pool.query("select sheet_revision, price_minor from listings where id = $1", [id]);
    return act(CHECKOUT, "startCheckoutAction", null, form({ [`ack.${id}`]: String(rows[0].sheet_revision), shownTotalMinor: String(rows[0].price_minor), shownCurrency: "EUR" }));
  },
  [`${BUYER_ORDERS} confirmDeliveryAction`]: async () => act(BUYER_ORDERS, "confirmDeliveryAction", (await shippedOrder(w)).orderId),
  [`${BUYER_ORDERS} requestReturnAction`]: async () => act(BUYER_ORDERS, "requestReturnAction", (await deliveredOrder(w)).orderId, null, form({ reason: "The choke hums at idle; I would like to send it back." })),
};

async function run(call: Call, persona: Persona) {
  state.userId = persona === "visitor" ? null : PERSONA_USER_IDS[persona];
  state.cookies = new Map();
  return outcomeOf(() => call(persona));
}

describe("server actions, as each kind of person", () => {
  it("has a call for every action in the matrix", () => {
    const missing = ACTIONS.filter((a) => !CAPTURE_ACTION_FILES.includes(a.file))
      .map((a) => `${a.file} ${a.name}`)
      .filter((k) => !(k in CALLS));
    expect(missing).toEqual([]);
  });

  for (const entry of ACTIONS.filter((a) => !CAPTURE_ACTION_FILES.includes(a.file))) {
    it(`${entry.name} (${entry.file})`, async () => {
      const call = CALLS[`${entry.file} ${entry.name}`];
      if (!call) throw new Error(`no call for ${entryKey(entry)}`);
      const wrong: string[] = [];
      for (const persona of PERSONAS) {
        const { outcome, detail } = await run(call, persona);
        if (outcome !== entry.expect[persona]) wrong.push(`${persona}: expected ${entry.expect[persona]}, got ${outcome} (${detail})`);
      }
      expect(wrong, `${entry.file} ${entry.name}\n  ${wrong.join("\n  ")}`).toEqual([]);
    }, 120_000);
  }
});
