-- Full-text search over live listings: a generated tsvector weighted title (A) > figures (B) >
-- description (C), with a GIN index, and a trigram index on titles for typo tolerance.
-- The column is not in the Drizzle schema; queries reach it with sql`search_vector`.
CREATE EXTENSION IF NOT EXISTS pg_trgm;
--> statement-breakpoint
ALTER TABLE "listings" ADD COLUMN "search_vector" tsvector GENERATED ALWAYS AS (
  setweight(to_tsvector('english', coalesce("title", '')), 'A') ||
  setweight(jsonb_to_tsvector('simple', "figures", '["string", "numeric"]'), 'B') ||
  setweight(to_tsvector('english', coalesce("description_md", '')), 'C')
) STORED;
--> statement-breakpoint
CREATE INDEX "listings_search_idx" ON "listings" USING gin ("search_vector");
--> statement-breakpoint
CREATE INDEX "listings_title_trgm_idx" ON "listings" USING gin ("title" gin_trgm_ops);
--> statement-breakpoint
INSERT INTO "platform_settings" ("id", "fee_bps") VALUES (1, 800) ON CONFLICT DO NOTHING;
