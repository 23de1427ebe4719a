// Starts the three local fakes together and closes them together. A fake that cannot start
// closes the ones that did, so a half-started stack never holds ports.
import { startMailFake, type MailFakeOptions } from "./mail/server";
import { startPaymentsFake } from "./payments/server";
import { startUploadsFake, type UploadsFakeOptions } from "./uploads/server";

type PaymentsFakeOptions = NonNullable<Parameters<typeof startPaymentsFake>[0]>;

export type FakesOptions = {
  host?: string;
  mail?: Omit<MailFakeOptions, "host">;
  payments?: Omit<PaymentsFakeOptions, "host">;
  uploads: Omit<UploadsFakeOptions, "host">;
};

export type RunningFakes = {
  urls: { mail: string; payments: string; uploads: string };
  close(): Promise<void>;
};

type Fake = { url: string; close(): Promise<void> };

const DEFAULT_PORTS = { mail: 4010, payments: 4020, uploads: 4030 };

function namePort<T>(name: string, port: number, start: () => Promise<T>): Promise<T> {
  return start().catch((error: unknown) => {
    const code = (error as NodeJS.ErrnoException | undefined)?.code;
    if (code === "EADDRINUSE") {
      throw Object.assign(new Error(`port ${port} (${name}) is already in use`), { code, cause: error });
    }
    throw error;
  });
}

export async function startFakes(options: FakesOptions): Promise<RunningFakes> {
  const host = options.host ?? "127.0.0.1";
  const mailPort = options.mail?.port ?? DEFAULT_PORTS.mail;
  const paymentsPort = options.payments?.port ?? DEFAULT_PORTS.payments;
  const uploadsPort = options.uploads.port ?? DEFAULT_PORTS.uploads;

  const started = await Promise.allSettled<Promise<Fake>[]>([
    namePort("mail fake", mailPort, () => startMailFake({ ...options.mail, host, port: mailPort })),
    namePort("payments fake", paymentsPort, () => startPaymentsFake({ ...options.payments, host, port: paymentsPort })),
    namePort("uploads fake", uploadsPort, () => startUploadsFake({ ...options.uploads, host, port: uploadsPort })),
  ]);

  const running = started.flatMap((s) => (s.status === "fulfilled" ? [s.value] : []));
  const failures = started.flatMap((s) => (s.status === "rejected" ? [s.reason as unknown] : []));
  if (failures.length > 0) {
    await Promise.allSettled(running.map((fake) => fake.close()));
    const messages = failures.map((f) => (f instanceof Error ? f.message : String(f)));
    throw Object.assign(new Error(messages.join("; ")), { cause: failures[0] });
  }

  const [mail, payments, uploads] = running as [Fake, Fake, Fake];
  let closing: Promise<void> | undefined;
  return {
    urls: { mail: mail.url, payments: payments.url, uploads: uploads.url },
    close() {
      closing ??= Promise.allSettled([mail.close(), payments.close(), uploads.close()]).then(() => undefined);
      return closing;
    },
  };
}
