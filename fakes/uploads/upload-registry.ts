// Uploads announced by the app's route handler (POST /route-metadata) and the results its
// onUploadComplete reports back (POST /callback-result), matched by file key.
import type { ServerResponse } from "node:http";

export type Registration = {
  keys: string[];
  remaining: Set<string>;
  metadata: Record<string, unknown>;
  isDev: boolean;
  callbackUrl: string;
  callbackSlug: string;
  awaitServerData: boolean;
  /** Dev mode: the open route-metadata response that carries callbacks to the SDK as JSON lines. */
  stream: ServerResponse | undefined;
  timer: NodeJS.Timeout;
};

export type CallbackOutcome = { ok: true; callbackData: unknown } | { ok: false; error: string };

type Waiter<T> = { resolve(value: T): void; timer: NodeJS.Timeout };

// The hosted service keeps a registration for as long as the presigned URL is valid (1 h by default).
const REGISTRATION_LIFETIME_MS = 60 * 60 * 1000;

export function createUploadRegistry() {
  const byKey = new Map<string, Registration>();
  const registrationWaiters = new Map<string, Waiter<Registration | undefined>[]>();
  const resultWaiters = new Map<string, Waiter<CallbackOutcome>>();

  function endStream(registration: Registration) {
    clearTimeout(registration.timer);
    if (registration.stream && !registration.stream.writableEnded) registration.stream.end();
    registration.stream = undefined;
  }

  function release(registration: Registration) {
    for (const key of registration.keys) if (byKey.get(key) === registration) byKey.delete(key);
    endStream(registration);
  }

  return {
    register(input: Omit<Registration, "remaining" | "timer" | "stream">, stream?: ServerResponse): Registration {
      const registration: Registration = {
        ...input,
        remaining: new Set(input.keys),
        stream,
        timer: setTimeout(() => release(registration), REGISTRATION_LIFETIME_MS).unref(),
      };
      for (const key of input.keys) {
        byKey.get(key)?.remaining.delete(key);
        byKey.set(key, registration);
        for (const waiter of registrationWaiters.get(key) ?? []) {
          clearTimeout(waiter.timer);
          waiter.resolve(registration);
        }
        registrationWaiters.delete(key);
      }
      stream?.on("close", () => {
        registration.stream = undefined;
      });
      return registration;
    },

    /**
     * In development the SDK registers in the background while the browser already uploads,
     * so a PUT may arrive first; give the registration a moment.
     */
    waitForRegistration(key: string, timeoutMs: number): Promise<Registration | undefined> {
      const found = byKey.get(key);
      if (found) return Promise.resolve(found);
      return new Promise((resolve) => {
        const list = registrationWaiters.get(key) ?? [];
        const waiter: Waiter<Registration | undefined> = {
          resolve,
          timer: setTimeout(() => {
            registrationWaiters.set(key, (registrationWaiters.get(key) ?? []).filter((w) => w !== waiter));
            resolve(undefined);
          }, timeoutMs),
        };
        list.push(waiter);
        registrationWaiters.set(key, list);
      });
    },

    /** Marks a key delivered; the dev stream ends once every key of its registration is. */
    finish(key: string): void {
      const registration = byKey.get(key);
      if (!registration) return;
      registration.remaining.delete(key);
      byKey.delete(key);
      if (registration.remaining.size === 0) release(registration);
    },

    /** Call before sending the callback, so a fast answer cannot be missed. */
    expectResult(key: string, timeoutMs: number): Promise<CallbackOutcome> {
      resultWaiters.get(key)?.resolve({ ok: false, error: "superseded by a newer upload of the same key" });
      return new Promise((resolve) => {
        const waiter: Waiter<CallbackOutcome> = {
          resolve: (outcome) => {
            clearTimeout(waiter.timer);
            if (resultWaiters.get(key) === waiter) resultWaiters.delete(key);
            resolve(outcome);
          },
          timer: setTimeout(
            () => waiter.resolve({ ok: false, error: `the app did not report the result of onUploadComplete within ${timeoutMs} ms` }),
            timeoutMs,
          ),
        };
        resultWaiters.set(key, waiter);
      });
    },

    deliverResult(key: string, outcome: CallbackOutcome): boolean {
      const waiter = resultWaiters.get(key);
      waiter?.resolve(outcome);
      return waiter !== undefined;
    },

    closeAll(): void {
      for (const registration of new Set(byKey.values())) release(registration);
      byKey.clear();
      for (const [key, waiters] of registrationWaiters) {
        for (const waiter of waiters) {
          clearTimeout(waiter.timer);
          waiter.resolve(undefined);
        }
        registrationWaiters.delete(key);
      }
      for (const waiter of resultWaiters.values()) waiter.resolve({ ok: false, error: "the uploads fake is shutting down" });
    },
  };
}

export type UploadRegistry = ReturnType<typeof createUploadRegistry>;
