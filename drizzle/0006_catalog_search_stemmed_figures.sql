-- Figures are searched with the same English stemming as the query (0004 used 'simple', so a
-- stemmed query word never matched a figure), and the catalog's unfiltered sorts get partial indexes.
DROP INDEX IF EXISTS "listings_search_idx";
--> statement-breakpoint
ALTER TABLE "listings" DROP COLUMN IF EXISTS "search_vector";
--> statement-breakpoint
ALTER TABLE "listings" ADD COLUMN "search_vector" tsvector GENERATED ALWAYS AS (
  setweight(to_tsvector('english', coalesce("title", '')), 'A') ||
  setweight(jsonb_to_tsvector('english', "figures", '["string", "numeric"]'), 'B') ||
  setweight(to_tsvector('english', coalesce("description_md", '')), 'C')
) STORED;
--> statement-breakpoint
CREATE INDEX "listings_search_idx" ON "listings" USING gin ("search_vector");
--> statement-breakpoint
CREATE INDEX "listings_live_newest_idx" ON "listings" ("live_at" DESC, "id") WHERE "state" = 'live';
--> statement-breakpoint
CREATE INDEX "listings_live_price_idx" ON "listings" ("price_minor", "id") WHERE "state" = 'live';
