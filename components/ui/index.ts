/**
 * Fluxyard's design system: small server-compatible components on the tokens of
 * tailwind.config.ts (paper, graphite, copper for actions, verdigris / amber / signal red for
 * states). Rules they keep so pages do not have to:
 * - every state is a word (`StateBadge`, `ProductStateBadge`, `Alert`), colour only backs it up;
 * - figures are mono with tabular digits (`Figure`, `TD numeric`, `NumberField` units);
 * - fields wire their hint and error with `aria-describedby` / `aria-invalid`, and form results
 *   go through the `FormMessage` live region;
 * - text people write is rendered by `@/components/markdown` and nothing else, and mains cautions
 *   come from `@/components/caution`.
 * Import from here or from the single file; both are the same module.
 */
export * from "./alert";
export * from "./button";
export * from "./card";
export * from "./cx";
export * from "./empty-state";
export * from "./error-state";
export * from "./field";
export * from "./figure";
export * from "./form-message";
export * from "./format";
export * from "./page-header";
export * from "./panel";
export * from "./skeleton";
export * from "./state-badge";
export * from "./table";
