import Link from "next/link";
import type { ComponentProps } from "react";
import { cx } from "./cx";

export type ButtonVariant = "primary" | "secondary" | "quiet" | "danger";
export type ButtonSize = "sm" | "md" | "lg";

const base =
  "inline-flex items-center justify-center gap-2 rounded font-medium no-underline " +
  "transition-colors disabled:cursor-not-allowed disabled:opacity-60 aria-disabled:pointer-events-none aria-disabled:opacity-60";

const variants: Record<ButtonVariant, string> = {
  primary: "bg-copper-600 text-white shadow-sm hover:bg-copper-700 hover:text-white active:bg-copper-800",
  secondary:
    "border border-graphite-300 bg-paper-raised text-graphite-900 shadow-sm hover:border-graphite-400 hover:bg-graphite-50 hover:text-graphite-900",
  quiet: "text-copper-700 hover:bg-copper-50 hover:text-copper-800",
  danger: "bg-signal-700 text-white shadow-sm hover:bg-signal-800 hover:text-white",
};

const sizes: Record<ButtonSize, string> = {
  sm: "h-8 px-3 text-sm",
  md: "h-10 px-4 text-sm",
  lg: "h-12 px-5 text-base",
};

/** Classes of a button, for the rare control that must look like one without being one. */
export function buttonClasses(variant: ButtonVariant = "primary", size: ButtonSize = "md"): string {
  return cx(base, variants[variant], sizes[size]);
}

export type ButtonProps = ComponentProps<"button"> & { variant?: ButtonVariant; size?: ButtonSize };

// `type="button"` by default so a button inside a form never submits it by surprise.
export function Button({ variant = "primary", size = "md", type = "button", className, ...props }: ButtonProps) {
  return <button type={type} className={cx(buttonClasses(variant, size), className)} {...props} />;
}

export type ButtonLinkProps = ComponentProps<typeof Link> & { variant?: ButtonVariant; size?: ButtonSize };

/** Navigation that looks like a button; it stays a link so it opens in a new tab and reads as one. */
export function ButtonLink({ variant = "primary", size = "md", className, ...props }: ButtonLinkProps) {
  return <Link className={cx(buttonClasses(variant, size), className)} {...props} />;
}
