import { cx } from "./cx";
import { formatSi, type FormatSiOptions } from "./format";

export type FigureProps = FormatSiOptions & {
  value: number;
  unit: string;
  digits?: number;
  className?: string;
};

/**
 * A measured or computed value in the mono face. The exact number rides along in `<data value>`
 * so copy tools and tests can read it without parsing the prefix.
 */
export function Figure({ value, unit, digits = 3, prefixes, className }: FigureProps) {
  const text = formatSi(value, unit, digits, { prefixes });
  const classes = cx("figure font-mono whitespace-nowrap", className);
  if (!Number.isFinite(value)) return <span className={classes}>{text}</span>;
  return (
    <data value={String(value)} className={classes}>
      {text}
    </data>
  );
}
