import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

// The header's session store against a stand-in for the browser: fetch answers from a queue the
// test controls, and `document` is an EventTarget whose visibility the test sets. The behaviour
// checked is React Query's, which the store replaced for the header: one request however many
// subscribers, a refetch when the tab becomes visible, and an update written locally (sign-out)
// that a late answer does not overwrite.

type Store = typeof import("@/components/site/session-store");

const signedIn = { user: { label: "Noor", roles: ["member"] } };
let answers: ((value: Response) => void)[];
let fetchMock: ReturnType<typeof vi.fn>;
let doc: EventTarget & { visibilityState: string };

async function freshStore(): Promise<Store> {
  vi.resetModules();
  return import("@/components/site/session-store");
}

const answer = (body: unknown, status = 200) => answers.shift()!(new Response(JSON.stringify(body), { status }));
const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

beforeEach(() => {
  answers = [];
  fetchMock = vi.fn(() => new Promise<Response>((resolve) => answers.push(resolve)));
  doc = Object.assign(new EventTarget(), { visibilityState: "visible" });
  vi.stubGlobal("fetch", fetchMock);
  vi.stubGlobal("document", doc);
  vi.spyOn(console, "warn").mockImplementation(() => {});
});

afterEach(() => {
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe("header session store", () => {
  it("asks once for any number of subscribers and tells each of them", async () => {
    const store = await freshStore();
    expect(store.readSession()).toEqual({ status: "pending", session: null });
    const a = vi.fn();
    const b = vi.fn();
    store.subscribeToSession(a);
    store.subscribeToSession(b);
    expect(fetchMock).toHaveBeenCalledTimes(1);
    expect(fetchMock.mock.calls[0]![0]).toBe("/api/session");
    answer(signedIn);
    await settle();
    expect(store.readSession()).toEqual({ status: "ready", session: signedIn });
    expect(a).toHaveBeenCalledTimes(1);
    expect(b).toHaveBeenCalledTimes(1);
    // The server's render and hydration always start from "not known yet".
    expect(store.sessionBeforeLoad()).toEqual({ status: "pending", session: null });
  });

  it("asks again when the tab becomes visible, and not while it is hidden or unsubscribed", async () => {
    const store = await freshStore();
    const stop = store.subscribeToSession(() => {});
    answer(signedIn);
    await settle();
    doc.visibilityState = "hidden";
    doc.dispatchEvent(new Event("visibilitychange"));
    expect(fetchMock).toHaveBeenCalledTimes(1);
    doc.visibilityState = "visible";
    doc.dispatchEvent(new Event("visibilitychange"));
    expect(fetchMock).toHaveBeenCalledTimes(2);
    answer({ user: null });
    await settle();
    expect(store.readSession().session).toEqual({ user: null });
    stop();
    doc.dispatchEvent(new Event("visibilitychange"));
    expect(fetchMock).toHaveBeenCalledTimes(2);
  });

  it("keeps what it knew when a later ask fails, and shows a visitor when the first one does", async () => {
    const first = await freshStore();
    first.subscribeToSession(() => {});
    answer({ error: "down" }, 503);
    await settle();
    expect(first.readSession()).toEqual({ status: "error", session: null });

    const store = await freshStore();
    store.subscribeToSession(() => {});
    answer(signedIn);
    await settle();
    doc.dispatchEvent(new Event("visibilitychange"));
    answer({ error: "down" }, 503);
    await settle();
    expect(store.readSession()).toEqual({ status: "ready", session: signedIn });
  });

  it("forgets the person at sign-out even when an answer from before arrives after it", async () => {
    const store = await freshStore();
    store.subscribeToSession(() => {});
    answer(signedIn);
    await settle();
    doc.dispatchEvent(new Event("visibilitychange"));
    store.forgetSession();
    expect(store.readSession()).toEqual({ status: "ready", session: { user: null } });
    answer(signedIn);
    await settle();
    expect(store.readSession()).toEqual({ status: "ready", session: { user: null } });
  });
});
