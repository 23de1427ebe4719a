// Who is signed in, for the header: one `GET /api/session` per tab, kept here and asked again when
// the tab comes back into view (as React Query's focus refetch does). A store for
// `useSyncExternalStore`: subscribeToSession, readSession, sessionBeforeLoad.
import type { HeaderSession } from "./nav-links";

export type SessionState = { status: "pending" | "ready" | "error"; session: HeaderSession | null };

const PENDING: SessionState = { status: "pending", session: null };
let state: SessionState = PENDING;
let inFlight: Promise<void> | null = null;
// Bumped by every publish, so an answer that was asked for before a sign-out cannot undo it.
let generation = 0;
const listeners = new Set<() => void>();

function publish(next: SessionState) {
  generation += 1;
  state = next;
  for (const listener of listeners) listener();
}

async function fetchSession(): Promise<HeaderSession> {
  const res = await fetch("/api/session", { cache: "no-store", credentials: "same-origin" });
  if (!res.ok) throw new Error(`GET /api/session answered ${res.status}`);
  return (await res.json()) as HeaderSession;
}

/** Asks once at a time; a failed ask keeps what was known (a visitor's header if nothing was). */
function refresh(): Promise<void> {
  const askedAt = generation;
  inFlight ??= fetchSession()
    .then(
      (session) => {
        if (generation === askedAt) publish({ status: "ready", session });
      },
      (error: unknown) => {
        console.warn("[header] could not read the session:", error);
        if (generation === askedAt && state.status === "pending") publish({ status: "error", session: null });
      },
    )
    .finally(() => {
      inFlight = null;
    });
  return inFlight;
}

function onVisible() {
  if (document.visibilityState === "visible") void refresh();
}

export function subscribeToSession(listener: () => void): () => void {
  listeners.add(listener);
  if (listeners.size === 1) {
    if (state.status === "pending") void refresh();
    document.addEventListener("visibilitychange", onVisible);
  }
  return () => {
    listeners.delete(listener);
    if (listeners.size === 0) document.removeEventListener("visibilitychange", onVisible);
  };
}

export function readSession(): SessionState {
  return state;
}

/** What the server render and the first client render show: nobody known yet. */
export function sessionBeforeLoad(): SessionState {
  return PENDING;
}

/** Sign-out: the header forgets the person at once, whatever answer is still on its way. */
export function forgetSession(): void {
  publish({ status: "ready", session: { user: null } });
}
