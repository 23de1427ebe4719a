// `npm run bench` runs every benchmark on a fresh benchmark database; `npm run bench -- catalog
// render` runs those (reusing the database when it already has the size they need). Each prints
// its figures and writes them to tests/.artifacts/bench/<name>.json. Benchmarks report targets;
// missing one is a finding, not a failure. A benchmark that cannot run makes the exit code 1.
import os from "node:os";
import { writeFigures } from "./support/artifacts";
import { createContext, type BenchContext } from "./support/context";
import { log } from "./support/environment";
import { runCatalogBench } from "./catalog";
import { runExplainBench } from "./explain";
import { runFirstLoadBench } from "./first-load";
import { runGenerateBench } from "./generate-bench";
import { runLighthouseBench } from "./lighthouse";
import { runRenderBench } from "./render";
import { runWaveformBench } from "./waveform";

type Bench = { needsEnvironment: boolean; run(ctx: BenchContext | null): Promise<unknown> };

const withContext = (run: (ctx: BenchContext) => Promise<unknown>): Bench => ({
  needsEnvironment: true,
  run: (ctx) => {
    if (!ctx) throw new Error("this benchmark needs the benchmark environment");
    return run(ctx);
  },
});

// The order of a full run: the catalog first, since it grows the database from 10k to 100k.
const BENCHES: Record<string, Bench> = {
  catalog: withContext(runCatalogBench),
  generate: withContext(runGenerateBench),
  render: withContext(runRenderBench),
  "first-load": withContext(runFirstLoadBench),
  lighthouse: withContext(runLighthouseBench),
  explain: withContext(runExplainBench),
  waveform: {
    needsEnvironment: false,
    // Owned by the waveform work; pure parsing and measuring, no server or database.
    run: () => runWaveformBench(),
  },
};

async function main(): Promise<number> {
  const args = process.argv.slice(2);
  const names = args.filter((a) => !a.startsWith("--"));
  const unknown = names.filter((n) => !(n in BENCHES));
  if (unknown.length > 0) {
    console.error(`unknown benchmark ${unknown.join(", ")}; known: ${Object.keys(BENCHES).join(", ")}`);
    return 2;
  }
  const selected = names.length > 0 ? names : Object.keys(BENCHES);
  // A full run starts from an empty cluster, so its figures never depend on an earlier run.
  const fresh = names.length === 0 || args.includes("--fresh");
  const started = Date.now();
  let ctx: BenchContext | null = null;
  const outcomes: { name: string; file?: string; error?: string }[] = [];
  try {
    if (selected.some((n) => BENCHES[n]!.needsEnvironment)) ctx = await createContext({ fresh });
    for (const name of selected) {
      log(`— ${name} —`);
      const startedAt = new Date();
      const loadBefore = os.loadavg();
      try {
        const figures = await BENCHES[name]!.run(ctx);
        const file = writeFigures(name, figures, { startedAt, loadBefore });
        log(`${name}: figures in ${file}`);
        outcomes.push({ name, file });
      } catch (error) {
        console.error(error);
        outcomes.push({ name, error: error instanceof Error ? error.message : String(error) });
      }
    }
  } finally {
    const running = ctx as BenchContext | null;
    await running?.env.stop().catch((e: unknown) => console.error(e));
  }
  log(`finished in ${Math.round((Date.now() - started) / 1000)} s`);
  for (const o of outcomes) console.log(o.error ? `  ✗ ${o.name}: ${o.error}` : `  ✓ ${o.name}: ${o.file}`);
  return outcomes.some((o) => o.error) ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (error) => {
    console.error(error);
    process.exit(1);
  },
);
