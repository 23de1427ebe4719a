// `npm test`: install if needed, then run every suite (tests/run.ts).
import { ensureInstalled, runTypeScript } from "../fakes/ensure-install.mjs";

ensureInstalled();
process.exitCode = await runTypeScript("tests/run.ts", process.argv.slice(2));
