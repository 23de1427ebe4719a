// What changed between the version a moderator approved and the one now in review.
// Pure functions: the review page renders their output, the unit tests pin them down.

export type DiffOp = "same" | "added" | "removed";
export type DiffLine = { op: DiffOp; text: string };

/**
 * Line diff through the longest common subsequence (dynamic programming, O(n·m) time and space).
 * Listing texts are a few hundred lines at most, so the quadratic table is small; a removal is
 * listed before the addition that replaces it, as unified diffs read.
 */
export function lineDiff(before: readonly string[], after: readonly string[]): DiffLine[] {
  const n = before.length;
  const m = after.length;
  // lcs[i][j] = length of the LCS of before[i..] and after[j..]
  const lcs: number[][] = Array.from({ length: n + 1 }, () => new Array<number>(m + 1).fill(0));
  for (let i = n - 1; i >= 0; i--) {
    const row = lcs[i]!;
    const next = lcs[i + 1]!;
    for (let j = m - 1; j >= 0; j--) {
      row[j] = before[i] === after[j] ? next[j + 1]! + 1 : Math.max(next[j]!, row[j + 1]!);
    }
  }
  const out: DiffLine[] = [];
  let i = 0;
  let j = 0;
  while (i < n && j < m) {
    if (before[i] === after[j]) {
      out.push({ op: "same", text: before[i]! });
      i++;
      j++;
    } else if (lcs[i + 1]![j]! >= lcs[i]![j + 1]!) {
      out.push({ op: "removed", text: before[i]! });
      i++;
    } else {
      out.push({ op: "added", text: after[j]! });
      j++;
    }
  }
  while (i < n) out.push({ op: "removed", text: before[i++]! });
  while (j < m) out.push({ op: "added", text: after[j++]! });
  return out;
}

export function splitLines(text: string): string[] {
  return text === "" ? [] : text.replace(/\r\n?/g, "\n").split("\n");
}

export function textDiff(before: string, after: string): DiffLine[] {
  return lineDiff(splitLines(before), splitLines(after));
}

export function hasChanges(lines: readonly DiffLine[]): boolean {
  return lines.some((l) => l.op !== "same");
}

export type ValueChange = { key: string; before: unknown; after: unknown };

/** Key order must not count as a change, so objects are compared by a sorted serialisation. */
export function stableStringify(value: unknown): string {
  if (value === undefined) return "undefined";
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  if (Array.isArray(value)) return `[${value.map(stableStringify).join(",")}]`;
  const entries = Object.entries(value as Record<string, unknown>)
    .filter(([, v]) => v !== undefined)
    .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${stableStringify(v)}`).join(",")}}`;
}

/** Field-by-field changes of two flat records (figures, the declaration); nested values compare whole. */
export function recordChanges(before: Record<string, unknown>, after: Record<string, unknown>): ValueChange[] {
  const keys = [...new Set([...Object.keys(before), ...Object.keys(after)])].sort();
  return keys
    .filter((key) => stableStringify(before[key]) !== stableStringify(after[key]))
    .map((key) => ({ key, before: before[key], after: after[key] }));
}

type NoteLike = { topic: string; text: string; waitSeconds?: number };

export type NoteChange = {
  topic: string;
  change: "added" | "removed" | "changed";
  lines: DiffLine[];
  waitBefore?: number;
  waitAfter?: number;
};

function joinNotes(notes: readonly NoteLike[]): Map<string, NoteLike> {
  const out = new Map<string, NoteLike>();
  for (const note of notes) {
    const seen = out.get(note.topic);
    out.set(note.topic, seen ? { topic: note.topic, text: `${seen.text}\n${note.text}`, waitSeconds: seen.waitSeconds ?? note.waitSeconds } : note);
  }
  return out;
}

/** Per safety topic: the note's line diff and any change of the stated wait. */
export function noteChanges(before: readonly NoteLike[], after: readonly NoteLike[], topicOrder: readonly string[] = []): NoteChange[] {
  const a = joinNotes(before);
  const b = joinNotes(after);
  const rank = (t: string) => (topicOrder.includes(t) ? topicOrder.indexOf(t) : topicOrder.length);
  const topics = [...new Set([...a.keys(), ...b.keys()])].sort((x, y) => rank(x) - rank(y) || x.localeCompare(y));
  const out: NoteChange[] = [];
  for (const topic of topics) {
    const was = a.get(topic);
    const now = b.get(topic);
    const lines = textDiff(was?.text ?? "", now?.text ?? "");
    const waitChanged = was?.waitSeconds !== now?.waitSeconds;
    if (!hasChanges(lines) && !waitChanged) continue;
    out.push({
      topic,
      change: !was ? "added" : !now ? "removed" : "changed",
      lines,
      ...(was?.waitSeconds !== undefined ? { waitBefore: was.waitSeconds } : {}),
      ...(now?.waitSeconds !== undefined ? { waitAfter: now.waitSeconds } : {}),
    });
  }
  return out;
}

/** The shape db/queries/listing-transitions.ts `snapshotListing` stores for an approved version. */
export type ListingSnapshot = {
  title?: unknown;
  kind?: unknown;
  magneticSubtype?: unknown;
  descriptionMd?: unknown;
  figures?: unknown;
  declaration?: unknown;
  safetyNotes?: unknown;
  checkpoints?: unknown;
  requirements?: unknown;
};

export type SnapshotDiff = {
  title: DiffLine[] | null;
  description: DiffLine[] | null;
  kind: ValueChange[];
  figures: ValueChange[];
  declaration: ValueChange[];
  notes: NoteChange[];
  checkpoints: DiffLine[] | null;
  requirements: DiffLine[] | null;
};

const asText = (v: unknown) => (typeof v === "string" ? v : "");
const asRecord = (v: unknown): Record<string, unknown> => (v && typeof v === "object" && !Array.isArray(v) ? (v as Record<string, unknown>) : {});
const asArray = (v: unknown): unknown[] => (Array.isArray(v) ? v : []);

function asNotes(v: unknown): NoteLike[] {
  return asArray(v).flatMap((n) => {
    const r = asRecord(n);
    if (typeof r.topic !== "string") return [];
    return [{ topic: r.topic, text: asText(r.text), ...(typeof r.waitSeconds === "number" ? { waitSeconds: r.waitSeconds } : {}) }];
  });
}

/** Lists of rows (checkpoints, requirements) diff as one line per row, so a moved or edited row shows. */
function rowLines(rows: unknown, describe: (row: Record<string, unknown>) => string): string[] {
  return asArray(rows).map((r) => describe(asRecord(r)));
}

const fmt = (v: unknown) => (v === null || v === undefined ? "—" : String(v));

export function describeCheckpoint(r: Record<string, unknown>): string {
  return `${fmt(r.stage)} · ${fmt(r.name)}: ${fmt(r.measure)} ${fmt(r.expectedMin)}–${fmt(r.expectedMax)} ${fmt(r.unit)}`;
}

export function describeRequirement(r: Record<string, unknown>): string {
  const at = r.minInductanceH != null ? ` ≥ ${fmt(r.minInductanceH)} H` : "";
  const current = r.atCurrentA != null ? ` at ${fmt(r.atCurrentA)} A` : "";
  return `${fmt(r.subtype)} · ${fmt(r.label)}${at}${current}`;
}

function changedOrNull(lines: DiffLine[]): DiffLine[] | null {
  return hasChanges(lines) ? lines : null;
}

/**
 * Part by part, what changed. A part the approved snapshot did not record (an older snapshot shape)
 * is not reported: "not recorded" is not a change the seller made.
 */
export function diffSnapshots(before: ListingSnapshot, after: ListingSnapshot, topicOrder: readonly string[] = []): SnapshotDiff {
  const has = (key: keyof ListingSnapshot) => key in before && before[key] !== undefined;
  return {
    title: has("title") ? changedOrNull(textDiff(asText(before.title), asText(after.title))) : null,
    description: has("descriptionMd") ? changedOrNull(textDiff(asText(before.descriptionMd), asText(after.descriptionMd))) : null,
    kind: has("kind") ? recordChanges({ kind: before.kind, magneticSubtype: before.magneticSubtype }, { kind: after.kind, magneticSubtype: after.magneticSubtype }) : [],
    figures: has("figures") ? recordChanges(asRecord(before.figures), asRecord(after.figures)) : [],
    declaration: has("declaration") ? recordChanges(asRecord(before.declaration), asRecord(after.declaration)) : [],
    notes: has("safetyNotes") ? noteChanges(asNotes(before.safetyNotes), asNotes(after.safetyNotes), topicOrder) : [],
    checkpoints: has("checkpoints")
      ? changedOrNull(lineDiff(rowLines(before.checkpoints, describeCheckpoint), rowLines(after.checkpoints, describeCheckpoint)))
      : null,
    requirements: has("requirements")
      ? changedOrNull(lineDiff(rowLines(before.requirements, describeRequirement), rowLines(after.requirements, describeRequirement)))
      : null,
  };
}

export function snapshotDiffIsEmpty(d: SnapshotDiff): boolean {
  return (
    !d.title &&
    !d.description &&
    d.kind.length === 0 &&
    d.figures.length === 0 &&
    d.declaration.length === 0 &&
    d.notes.length === 0 &&
    !d.checkpoints &&
    !d.requirements
  );
}
