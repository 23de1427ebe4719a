import { describe, expect, it } from "vitest";
import { EnvError, parseEnv } from "@/lib/env";

const productionEnv = {
  NODE_ENV: "production",
  DATABASE_URL: "postgres://app@db.internal:5432/fluxyard",
  APP_URL: "https://fluxyard.example",
  AUTH_SECRET: "x".repeat(40),
  MAIL_FROM: "Fluxyard <no-reply@fluxyard.example>",
  RESEND_API_KEY: "re_live_key",
  STRIPE_SECRET_KEY: "sk_live_key",
  STRIPE_WEBHOOK_SECRET: "whsec_live",
  UPLOADTHING_TOKEN: "eyJhcGlLZXkiOiJ4In0=",
};

function problems(source: Record<string, string | undefined>): string[] {
  try {
    parseEnv(source);
    return [];
  } catch (error) {
    expect(error).toBeInstanceOf(EnvError);
    return (error as EnvError).problems;
  }
}

describe("parseEnv", () => {
  it("accepts a complete production environment", () => {
    const env = parseEnv(productionEnv);
    expect(env.DATABASE_URL).toBe(productionEnv.DATABASE_URL);
    expect(env.RESEND_BASE_URL).toBeUndefined();
  });

  it.each(["DATABASE_URL", "AUTH_SECRET", "STRIPE_SECRET_KEY", "STRIPE_WEBHOOK_SECRET", "RESEND_API_KEY", "UPLOADTHING_TOKEN", "APP_URL"])(
    "names %s when it is missing in production",
    (name) => {
      const found = problems({ ...productionEnv, [name]: undefined });
      expect(found).toHaveLength(1);
      expect(found[0]).toMatch(new RegExp(`^${name} `));
    },
  );

  it("treats an empty value as missing", () => {
    expect(problems({ ...productionEnv, AUTH_SECRET: "" })[0]).toMatch(/^AUTH_SECRET is missing/);
  });

  it("names invalid values and says what is expected", () => {
    const found = problems({ ...productionEnv, DATABASE_URL: "mysql://x", AUTH_SECRET: "short", STRIPE_SECRET_KEY: "pk_test_1" });
    expect(found).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^DATABASE_URL must be a postgres:\/\/ URL/),
        expect.stringMatching(/^AUTH_SECRET must be at least 32 characters/),
        expect.stringMatching(/^STRIPE_SECRET_KEY must start with sk_/),
      ]),
    );
  });

  it("the error message lists every problem for the operator", () => {
    expect(() => parseEnv({ NODE_ENV: "production" })).toThrow(/DATABASE_URL[\s\S]*AUTH_SECRET[\s\S]*UPLOADTHING_TOKEN/);
  });

  it("fills the local fakes' defaults outside production", () => {
    const env = parseEnv({ NODE_ENV: "development" });
    expect(env.RESEND_BASE_URL).toBe("http://127.0.0.1:4010");
    expect(env.STRIPE_API_URL).toBe("http://127.0.0.1:4020");
    expect(JSON.parse(Buffer.from(env.UPLOADTHING_TOKEN, "base64").toString())).toMatchObject({ appId: "fluxyard-local" });
  });

  it("never applies local defaults in production", () => {
    expect(problems({ ...productionEnv, RESEND_BASE_URL: undefined })).toEqual([]);
    expect(parseEnv(productionEnv).STRIPE_API_URL).toBeUndefined();
  });
});
