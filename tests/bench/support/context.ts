// What the benchmarks of one run share: the environment, and a database grown to the size a
// benchmark asks for (kept between runs, regenerated when it holds more than asked).
import { generateCatalog, generatedListings, type GenerateReport } from "../generate";
import { log, startEnvironment, type BenchEnvironment } from "./environment";

export type BenchContext = {
  env: BenchEnvironment;
  /** every generation this run did, in order */
  generations: GenerateReport[];
  ensureListings(n: number): Promise<void>;
};

export async function createContext({ fresh }: { fresh: boolean }): Promise<BenchContext> {
  const env = await startEnvironment({ freshCluster: fresh });
  const generations: GenerateReport[] = [];
  return {
    env,
    generations,
    async ensureListings(n) {
      let have = await generatedListings(env.pool);
      if (have === n) {
        log(`the benchmark database already holds ${n.toLocaleString("en")} generated listings`);
        return;
      }
      if (have > n) {
        log(`the benchmark database holds ${have.toLocaleString("en")} listings; starting again from the demo seed`);
        await env.resetDatabase();
        have = 0;
      }
      generations.push(await generateCatalog(env.pool, { from: have, to: n, log }));
    },
  };
}
