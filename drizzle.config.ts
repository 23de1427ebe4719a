import { defineConfig } from "drizzle-kit";

// drizzle-kit only generates SQL from the schema here; the app and tests apply it with the migrator.
export default defineConfig({
  dialect: "postgresql",
  schema: "./db/schema/index.ts",
  out: "./drizzle",
  strict: true,
});
