// The generator as a benchmark: how long 100,000 listings and their orders, posts and logs take
// to write. In a full run the catalog benchmark has already generated them (10k, then 90k more),
// and those runs are reported; run alone, it starts from the demo seed and generates 100k at once.
import { FULL_LISTINGS } from "./support/config";
import type { BenchContext } from "./support/context";
import type { GenerateReport } from "./generate";

export type GenerateFigures = { runs: GenerateReport[]; listings: number; totalSeconds: number; tableRows: Record<string, number> };

export async function runGenerateBench(ctx: BenchContext): Promise<GenerateFigures> {
  if (ctx.generations.length === 0) {
    await ctx.env.resetDatabase();
    await ctx.ensureListings(FULL_LISTINGS);
  } else {
    await ctx.ensureListings(FULL_LISTINGS);
  }
  const tables = ["users", "seller_profiles", "listings", "uploads", "listing_photos", "listing_checkpoints", "listing_requirements", "checkouts", "orders", "order_lines", "questions", "answers", "bring_up_logs", "log_checkpoints", "readings"];
  // Exact counts, demo seed included: what the other benchmarks run against.
  const { rows } = await ctx.env.pool.query<{ table: string; n: string }>(tables.map((t) => `select '${t}' as table, count(*)::text as n from "${t}"`).join(" union all "));
  const tableRows = Object.fromEntries(rows.map((r) => [r.table, Number(r.n)]));
  const totalSeconds = Math.round(ctx.generations.reduce((s, g) => s + g.seconds, 0) * 10) / 10;
  console.log(`\n  generated ${FULL_LISTINGS.toLocaleString("en")} listings in ${totalSeconds} s (${ctx.generations.map((g) => `${g.fromListings}→${g.toListings}: ${g.seconds} s`).join(", ")})`);
  for (const [table, n] of Object.entries(tableRows)) console.log(`    ${table.padEnd(22)} ${n.toLocaleString("en").padStart(9)}`);
  console.log("");
  return { runs: ctx.generations, listings: FULL_LISTINGS, totalSeconds, tableRows };
}
