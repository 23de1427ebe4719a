// `npm start`: install if needed, then start the database, the fakes and the app (fakes/start.ts).
import { ensureInstalled, runTypeScript } from "./ensure-install.mjs";

ensureInstalled();
process.exitCode = await runTypeScript("fakes/start.ts", process.argv.slice(2));
