-- Indexes that EXPLAIN ANALYZE of the catalog's most frequent reads called for (tests/bench/explain.ts).
-- Custom SQL: Drizzle's index builder has no INCLUDE, and these are partial indexes over live listings.

-- The catalog sorts newest first as `live_at desc nulls last, id` and a text search reads its
-- matches in that order; `live_at desc` alone is NULLS FIRST, which cannot give that order.
CREATE INDEX IF NOT EXISTS "listings_live_newest_nulls_last_idx" ON "listings" ("live_at" DESC NULLS LAST, "id") WHERE "state" = 'live';
--> statement-breakpoint
DROP INDEX IF EXISTS "listings_live_newest_idx";
--> statement-breakpoint
-- Kind and subtype filters with a price range and price order, and their counts, from the index
-- alone; also the cheapest live magnetics of one subtype that meet a kit's requirement.
CREATE INDEX IF NOT EXISTS "listings_live_facets_idx" ON "listings" ("kind", "magnetic_subtype", "price_minor", "id") INCLUDE ("stock", "mains_connected", "inductance_h", "rated_current_a") WHERE "state" = 'live';
--> statement-breakpoint
-- "Kits this part fits": live kits walked in title order until twelve fit.
CREATE INDEX IF NOT EXISTS "listings_live_kits_title_idx" ON "listings" ("title", "id") WHERE "state" = 'live' AND "kind" = 'kit';
