// Runs a TypeScript entry of the app outside Next.js (the background worker): tsx compiles it, and
// "server-only" — which would refuse to load outside React's server runtime — resolves to an empty
// module, since everything the worker runs is server code by definition.
import { register } from "node:module";
import { register as registerTsx } from "tsx/esm/api";

registerTsx();
const hook = `
export async function resolve(specifier, context, next) {
  if (specifier === "server-only") return { url: "data:text/javascript,export {}", shortCircuit: true };
  return next(specifier, context);
}`;
// Registered after tsx, so it is asked first.
register(`data:text/javascript,${encodeURIComponent(hook)}`);
