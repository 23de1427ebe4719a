import { z } from "zod";

// The one place that reads process.env. Validated once, on first use; in production every
// variable must be set explicitly, elsewhere the local defaults (the fakes, the embedded database) fill in.

const url = (what: string) => z.url({ message: `must be a URL (${what})` });

const schema = z.object({
  NODE_ENV: z.enum(["development", "production", "test"]).default("development"),
  DATABASE_URL: z
    .string({ message: "is missing (a postgres:// URL of the database)" })
    .regex(/^postgres(ql)?:\/\//, "must be a postgres:// URL"),
  APP_URL: url("the public address of the app, e.g. https://fluxyard.example"),
  AUTH_SECRET: z.string({ message: "is missing (32 or more random characters)" }).min(32, "must be at least 32 characters"),
  MAIL_FROM: z.string({ message: "is missing (the sender, e.g. Fluxyard <no-reply@example.org>)" }).min(3),
  RESEND_API_KEY: z.string({ message: "is missing (the mail provider's API key)" }).min(1),
  RESEND_BASE_URL: url("the mail API, e.g. the local fake http://127.0.0.1:4010").optional(),
  STRIPE_SECRET_KEY: z.string({ message: "is missing (the payment provider's secret key)" }).regex(/^sk_/, "must start with sk_"),
  STRIPE_WEBHOOK_SECRET: z.string({ message: "is missing (the webhook signing secret)" }).regex(/^whsec_/, "must start with whsec_"),
  STRIPE_API_URL: url("the payment API, e.g. the local fake http://127.0.0.1:4020").optional(),
  UPLOADTHING_TOKEN: z.string({ message: "is missing (the upload provider's token)" }).min(10),
  UPLOADS_PUBLIC_ORIGIN: url("where uploaded files are served from").optional(),
  MAIL_OUTBOX_URL: url("the local outbox page").optional(),
});

export type Env = z.infer<typeof schema>;

const LOCAL_DEFAULTS: Partial<Record<keyof Env, string>> = {
  DATABASE_URL: "postgres://fluxyard@127.0.0.1:54329/fluxyard",
  APP_URL: "http://localhost:3000",
  AUTH_SECRET: "local-development-secret-not-for-production-use",
  MAIL_FROM: "Fluxyard <no-reply@fluxyard.test>",
  RESEND_API_KEY: "re_local_fake_key",
  RESEND_BASE_URL: "http://127.0.0.1:4010",
  STRIPE_SECRET_KEY: "sk_test_local_fake_key",
  STRIPE_WEBHOOK_SECRET: "whsec_local_fake_secret",
  STRIPE_API_URL: "http://127.0.0.1:4020",
  UPLOADS_PUBLIC_ORIGIN: "http://127.0.0.1:4030",
  MAIL_OUTBOX_URL: "http://127.0.0.1:4010",
};

export class EnvError extends Error {
  constructor(readonly problems: string[]) {
    super(`Fluxyard cannot start: the environment is invalid.\n${problems.map((p) => `  - ${p}`).join("\n")}`);
    this.name = "EnvError";
  }
}

export function parseEnv(source: Record<string, string | undefined>): Env {
  const production = source.NODE_ENV === "production";
  const keys = Object.keys(schema.shape) as (keyof Env)[];
  const input: Record<string, string | undefined> = {};
  for (const key of keys) {
    const value = source[key];
    input[key] = value === "" ? undefined : value;
    if (input[key] === undefined && !production) input[key] = LOCAL_DEFAULTS[key];
  }
  // The local token names the fake's app; in production it must come from the provider.
  if (input.UPLOADTHING_TOKEN === undefined && !production) input.UPLOADTHING_TOKEN = localUploadthingToken();
  const parsed = schema.safeParse(input);
  if (!parsed.success) {
    throw new EnvError(parsed.error.issues.map((issue) => `${issue.path.join(".")} ${issue.message}`));
  }
  return parsed.data;
}

export function localUploadthingToken(): string {
  return Buffer.from(JSON.stringify({ apiKey: "sk_local_uploads_fake", appId: "fluxyard-local", regions: ["local"] })).toString(
    "base64",
  );
}

let cached: Env | undefined;

/** Validated environment; throws EnvError naming every missing or invalid variable. */
export function env(): Env {
  cached ??= parseEnv(process.env);
  return cached;
}

/** Tests that change the environment between cases call this; the app never does. */
export function _resetEnvForTests(): void {
  cached = undefined;
}
