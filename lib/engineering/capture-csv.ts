// Oscilloscope captures saved as CSV (or tab/semicolon text). Instruments disagree on everything
// around the numbers — metadata lines, header rows, unit rows, separators, decimal commas — so the
// parser finds the block of numeric rows first and then reads what sits above it.
import { EngineeringInputError } from "./errors";

export type CaptureChannel = { name: string; unit?: string; values: Float64Array };
export type ParsedCapture = { timeS: Float64Array; channels: CaptureChannel[]; sampleIntervalS: number };

type Delimiter = "\t" | ";" | ",";
const DELIMITERS: readonly Delimiter[] = ["\t", ";", ","];
const DELIMITER_NAMES: Record<Delimiter, string> = { "\t": "tabs", ";": "semicolons", ",": "commas" };
/** Lines looked at to find the delimiter, the header and the metadata; data rows beyond are streamed. */
const HEAD_SCAN_LINES = 400;

const TIME_SCALE: Record<string, number> = {
  s: 1, sec: 1, secs: 1, second: 1, seconds: 1,
  ms: 1e-3, us: 1e-6, "µs": 1e-6, "μs": 1e-6, ns: 1e-9, ps: 1e-12,
};
// Channel units with an SI prefix are brought to the base unit, so figures are always in V or A.
const CHANNEL_UNITS: Record<string, { unit: string; scale: number }> = {
  v: { unit: "V", scale: 1 }, volt: { unit: "V", scale: 1 }, volts: { unit: "V", scale: 1 },
  mv: { unit: "V", scale: 1e-3 }, uv: { unit: "V", scale: 1e-6 }, "µv": { unit: "V", scale: 1e-6 }, "μv": { unit: "V", scale: 1e-6 },
  kv: { unit: "V", scale: 1e3 },
  a: { unit: "A", scale: 1 }, amp: { unit: "A", scale: 1 }, amps: { unit: "A", scale: 1 },
  ma: { unit: "A", scale: 1e-3 }, ua: { unit: "A", scale: 1e-6 }, "µa": { unit: "A", scale: 1e-6 }, "μa": { unit: "A", scale: 1e-6 },
  ka: { unit: "A", scale: 1e3 },
};
const INDEX_UNITS = new Set(["sequence", "sample", "samples", "index", "point", "points", "pt", "pts", "#", "no", "no."]);
const OTHER_UNITS = new Set(["w", "hz", "khz", "mhz", "%", "°c", "degc", "div", "db", "dbv", "dbm", "ohm", "ω", "s/div", "v/div"]);

const TIME_NAME = /^(time|t|s|x|x-axis|zeit|temps|tiempo|tempo|seconds?|sec)$|\btime\b/i;
const INDEX_NAME = /^(index|idx|sample|samples|sequence|point|points|no\.?|#|n)$/i;
const INTERVAL_KEY = /sampl\w*\s*(interval|period|time)|time\s*(interval|increment|step|per\s*sample)|x\s*inc(rement)?|^increment$|^dt$|delta\s*t|^xinc$|^interval$/i;
const RATE_KEY = /sampl\w*\s*(rate|frequency)|^fs$|^sa\/s$/i;
const START_KEY = /^start$|start\s*time|^x\s*(start|origin|0)$|^xorigin$|^t0$|time\s*offset|first\s*(sample|point)\s*time/i;

/** Reads a capture: a time column (or a sample interval) and one or more channels. */
export function parseCaptureCsv(text: string): ParsedCapture {
  if (typeof text !== "string") throw captureError("The capture must be text (a CSV or tab-separated file).");
  let source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  if (source.indexOf("\n") === -1 && source.indexOf("\r") !== -1) source = source.replace(/\r/g, "\n");
  if (source.indexOf("\u0000") !== -1) throw captureError("The file holds binary data, not text: save the capture as CSV.");

  const head = readHeadLines(source);
  if (head.length === 0) throw captureError("The file is empty.");
  const layout = findLayout(head);
  const headBefore = head.filter((line) => line.number < layout.dataLine.number);
  const side = layout.skip === 0 ? [] : sideColumns(head, layout);
  const meta = readMetadata([...headBefore, ...side], layout.delimiter, layout.decimalComma);
  const columns = describeColumns(headBefore, layout, meta);
  const rows = readRows(source, layout, columns);
  return assemble(rows, columns, meta);
}

function sideColumns(head: HeadLine[], layout: Layout): HeadLine[] {
  return head
    .filter((line) => line.number >= layout.dataLine.number)
    .map((line) => ({ ...line, text: splitFields(line.text, layout.delimiter).slice(0, layout.skip).join(layout.delimiter) }))
    .filter((line) => line.text.replaceAll(layout.delimiter, "").trim() !== "");
}

function captureError(message: string): EngineeringInputError {
  return new EngineeringInputError("capture", message);
}

type HeadLine = { number: number; text: string; start: number };

function readHeadLines(source: string): HeadLine[] {
  const lines: HeadLine[] = [];
  let pos = 0;
  let number = 0;
  while (pos <= source.length && lines.length < HEAD_SCAN_LINES) {
    let end = source.indexOf("\n", pos);
    if (end === -1) end = source.length;
    number += 1;
    const raw = source.slice(pos, end).replace(/\r$/, "");
    if (raw.trim() !== "") lines.push({ number, text: raw, start: pos });
    if (end >= source.length) break;
    pos = end + 1;
  }
  return lines;
}

function splitFields(text: string, delimiter: Delimiter): string[] {
  const fields = text.split(delimiter).map(unquote);
  while (fields.length > 1 && fields[fields.length - 1] === "") fields.pop();
  return fields;
}

function unquote(field: string): string {
  const t = field.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1).trim() : t;
}

/** A number as instruments write it: decimal or scientific, optionally with a decimal comma; NaN otherwise. */
function parseNumber(raw: string, decimalComma: boolean): number {
  let s = raw;
  if (s.charCodeAt(0) === 34) s = unquote(s);
  if (decimalComma) s = s.replace(",", ".");
  const value = +s;
  if (value !== value || value === Infinity || value === -Infinity) return Number.NaN;
  // `+` also accepts "", "  ", "0x1f", "0b1" and "0o7", which are not measurements.
  if (value === 0 && !/\d/.test(s)) return Number.NaN;
  const c0 = s.charCodeAt(0);
  if (c0 === 48 && s.length > 2) {
    const c1 = s.charCodeAt(1) | 0x20;
    if (c1 === 120 || c1 === 98 || c1 === 111) return Number.NaN;
  } else if (c0 <= 32) {
    const t = s.trim();
    if (t.length > 2 && t.charCodeAt(0) === 48 && /[xbo]/i.test(t[1] ?? "")) return Number.NaN;
  }
  return value;
}

/** `skip` leading columns of each row are not samples (a metadata block written beside the samples). */
type Layout = { delimiter: Delimiter; decimalComma: boolean; width: number; skip: number; dataLine: HeadLine };

function numericFields(fields: string[], decimalComma: boolean): boolean {
  return fields.every((f) => !Number.isNaN(parseNumber(f, decimalComma)));
}

/** The delimiter that gives the widest block of numeric rows, and where that block starts. */
function findLayout(head: HeadLine[]): Layout {
  let best: Layout | null = null;
  for (const delimiter of DELIMITERS) {
    const split = head.map((line) => splitFields(line.text, delimiter));
    for (let i = 0; i < head.length; i += 1) {
      const fields = split[i] ?? [];
      const decimalComma = delimiter !== "," && head.slice(i).some((l) => l.text.includes(","));
      if (!numericFields(fields, decimalComma)) continue;
      const next = split[i + 1];
      // A lone number among metadata (a record length, say) is not the start of the data.
      if (fields.length === 1 && next && next.length !== 1) continue;
      const line = head[i]!;
      if (!best || fields.length > best.width) best = { delimiter, decimalComma, width: fields.length, skip: 0, dataLine: line };
      break;
    }
  }
  best ??= findSideBySideLayout(head);
  if (!best) {
    const last = head[head.length - 1]!;
    throw captureError(
      `No rows of numbers found (looked at lines 1–${last.number}): a capture needs one sample per line, written as numbers such as 0.0012 or 1.2E-3.`,
    );
  }
  return best;
}

/**
 * Samples in the right-hand columns with metadata in the left-hand ones for the first rows, and empty
 * cells there below them (`Record length,1000,,-1e-6,0.02` then `,,,-0.9e-6,0.03`).
 */
function findSideBySideLayout(head: HeadLine[]): Layout | null {
  for (const delimiter of DELIMITERS) {
    const split = head.map((line) => splitFields(line.text, delimiter));
    for (let i = 0; i < split.length; i += 1) {
      const fields = split[i]!;
      let skip = 0;
      while (skip < fields.length && fields[skip] === "") skip += 1;
      if (skip === 0 || skip === fields.length) continue;
      const decimalComma = delimiter !== "," && head.slice(i).some((l) => l.text.includes(","));
      if (!numericFields(fields.slice(skip), decimalComma)) continue;
      const total = fields.length;
      let start = i;
      while (start > 0) {
        const above = split[start - 1]!;
        if (above.length !== total || !numericFields(above.slice(skip), decimalComma)) break;
        start -= 1;
      }
      return { delimiter, decimalComma, width: total - skip, skip, dataLine: head[start]! };
    }
  }
  return null;
}

type Metadata = { intervalS: number | null; startS: number; keyValueLines: Set<number> };

/** `Sample interval,1e-6`, `Sample rate: 1 MSa/s`, and key rows over value rows (`X,CH1,Start,Increment`). */
function readMetadata(lines: HeadLine[], delimiter: Delimiter, decimalComma: boolean): Metadata {
  const meta: Metadata = { intervalS: null, startS: 0, keyValueLines: new Set() };
  const pairs: { key: string; value: string; line: number; inline: boolean }[] = [];
  let previous: string[] | null = null;
  for (const line of lines) {
    const fields = splitFields(line.text, delimiter);
    const keyValue = /^\s*"?([^:=]+?)"?\s*[:=]\s*(.+?)\s*$/.exec(line.text);
    if (fields.length === 1 && keyValue) pairs.push({ key: keyValue[1]!, value: keyValue[2]!, line: line.number, inline: true });
    for (let i = 0; i + 1 < fields.length; i += 1) {
      const key = fields[i]!;
      if (key !== "" && Number.isNaN(parseNumber(key, decimalComma)) && !Number.isNaN(leadingNumber(fields[i + 1]!, decimalComma).value)) {
        pairs.push({ key, value: fields.slice(i + 1).join(" "), line: line.number, inline: true });
      }
    }
    if (previous) {
      for (let i = 0; i < fields.length && i < previous.length; i += 1) {
        const key = previous[i]!;
        const value = fields[i]!;
        if (key !== "" && Number.isNaN(parseNumber(key, decimalComma)) && !Number.isNaN(parseNumber(value, decimalComma))) {
          pairs.push({ key, value, line: line.number, inline: false });
        }
      }
    }
    previous = fields;
  }
  for (const { key, value, line, inline } of pairs) {
    const name = key.trim();
    const known = INTERVAL_KEY.test(name) || RATE_KEY.test(name) || START_KEY.test(name);
    if (inline && known) meta.keyValueLines.add(line);
    if (INTERVAL_KEY.test(name)) {
      const seconds = timeValue(value, decimalComma);
      if (seconds !== null && seconds > 0) meta.intervalS = seconds;
      else throw captureError(`Line ${line}: the sample interval "${value.trim()}" is not a positive time.`);
    } else if (RATE_KEY.test(name) && meta.intervalS === null) {
      const rate = rateValue(value, decimalComma);
      if (rate !== null && rate > 0) meta.intervalS = 1 / rate;
      else throw captureError(`Line ${line}: the sample rate "${value.trim()}" is not a positive rate.`);
    } else if (START_KEY.test(name)) {
      const seconds = timeValue(value, decimalComma);
      if (seconds !== null) meta.startS = seconds;
    }
  }
  return meta;
}

function leadingNumber(raw: string, decimalComma: boolean): { value: number; rest: string } {
  const match = /^\s*"?\s*([+-]?(?:\d+[.,]?\d*|[.,]\d+)(?:[eE][+-]?\d+)?)\s*(.*?)"?\s*$/.exec(raw);
  if (!match) return { value: Number.NaN, rest: "" };
  const literal = decimalComma || !match[1]!.includes(".") ? match[1]!.replace(",", ".") : match[1]!;
  return { value: Number(literal), rest: match[2]!.trim() };
}

function timeValue(raw: string, decimalComma: boolean): number | null {
  const { value, rest } = leadingNumber(raw, decimalComma);
  if (!Number.isFinite(value)) return null;
  const unit = rest.split(/[\s,;]/)[0]?.toLowerCase() ?? "";
  if (unit === "") return value;
  const scale = TIME_SCALE[unit];
  return scale === undefined ? null : value * scale;
}

function rateValue(raw: string, decimalComma: boolean): number | null {
  const { value, rest } = leadingNumber(raw, decimalComma);
  if (!Number.isFinite(value)) return null;
  const unit = rest.split(/\s/)[0]?.toLowerCase() ?? "";
  const prefix = /^([kmg]?)(sa\/s|s\/s|sps|hz|samples\/s)?$/.exec(unit);
  if (!prefix) return null;
  const scale = { "": 1, k: 1e3, m: 1e6, g: 1e9 }[prefix[1] as "" | "k" | "m" | "g"];
  return value * scale;
}

type ColumnKind = { kind: "time"; scale: number } | { kind: "index" } | { kind: "channel"; name: string; unit?: string; scale: number };
/** `firstMayBeTime`: no header names the columns, so an increasing first column is taken as time. */
type Columns = { kinds: ColumnKind[]; headerLine: number | null; firstMayBeTime: boolean };

/** Names and units from the header row (and a unit row under it, if any); which column is time. */
function describeColumns(lines: HeadLine[], layout: Layout, meta: Metadata): Columns {
  const width = layout.width;
  // A metadata line (`Sample interval: 2 us`) is never the header.
  const candidates = lines.filter((line) => !meta.keyValueLines.has(line.number));
  const split = candidates.map((line) => splitFields(line.text, layout.delimiter).slice(layout.skip));
  const isTextRow = (fields: string[] | undefined) =>
    !!fields && fields.length >= width && fields.slice(0, width).every((f) => f === "" || Number.isNaN(parseNumber(f, layout.decimalComma)));
  const last = split[split.length - 1];
  const beforeLast = split[split.length - 2];
  let headerIndex = -1;
  let unitRow: string[] | null = null;
  // A unit row (`(s),(V)` or `Sequence,Volt,…`) sits under the header; it may carry numbers past the data columns.
  // The header over a unit row may number its channels (`x-axis,1,2` over `second,Volt,Volt`).
  const namesRow = !!beforeLast && beforeLast.length >= width && Number.isNaN(parseNumber(beforeLast[0]!, layout.decimalComma));
  if (last && last.length >= width && last.slice(0, width).every(isUnitLike) && namesRow) {
    unitRow = last;
    headerIndex = split.length - 2;
  } else if (isTextRow(last)) {
    headerIndex = split.length - 1;
  }
  const header = headerIndex >= 0 ? split[headerIndex]!.slice(0, width) : null;
  const headerLine = headerIndex >= 0 ? candidates[headerIndex]!.number : null;

  const described = Array.from({ length: width }, (_, i) => {
    const raw = header?.[i] ?? "";
    const inline = /^(.*?)\s*[([]\s*([^)\]]*)\s*[)\]]\s*$/.exec(raw);
    const name = (inline ? inline[1]! : raw).trim();
    const unitText = (unitRow ? stripBrackets(unitRow[i] ?? "") : "") || (inline ? inline[2]!.trim() : "");
    return { name, unit: unitText };
  });

  const kinds: ColumnKind[] = described.map(({ name, unit }, i) => {
    const unitKey = unit.toLowerCase();
    if (INDEX_UNITS.has(unitKey) || (header && INDEX_NAME.test(name) && !(unitKey in TIME_SCALE))) {
      return i === 0 ? { kind: "index" } : channel(name, unit, i);
    }
    if (unitKey in TIME_SCALE || (header && TIME_NAME.test(name))) {
      return { kind: "time", scale: TIME_SCALE[unitKey] ?? 1 };
    }
    return channel(name, unit, i);
  });

  const timeColumns = kinds.filter((k) => k.kind === "time" || k.kind === "index").length;
  if (timeColumns > 1) {
    // Several time-like headings: the first is the time axis, the rest are channels named so.
    let seen = false;
    for (let i = 0; i < kinds.length; i += 1) {
      const k = kinds[i]!;
      if (k.kind === "time" || k.kind === "index") {
        if (seen) kinds[i] = channel(described[i]!.name, described[i]!.unit, i);
        seen = true;
      }
    }
  }
  if (kinds.some((k) => k.kind === "index") && meta.intervalS === null) {
    throw captureError(
      `Line ${headerLine ?? layout.dataLine.number}: the first column counts samples, but no sample interval is given; add a line such as "Sample interval,1e-6".`,
    );
  }
  if (!kinds.some((k) => k.kind === "time" || k.kind === "index") && meta.intervalS === null) {
    if (width >= 2 && !header) kinds[0] = { kind: "time", scale: 1 };
    else {
      throw captureError(
        header
          ? `Line ${headerLine}: no column is named as time (such as "Time (s)") and no sample interval is given.`
          : `Line ${layout.dataLine.number}: one column of samples and no sample interval; add a line such as "Sample interval,1e-6" above the samples.`,
      );
    }
  }
  if (kinds.every((k) => k.kind !== "channel")) {
    throw captureError(`Line ${headerLine ?? layout.dataLine.number}: the capture has a time column but no channel of samples.`);
  }
  const firstMayBeTime = !header && width >= 2 && kinds[0]!.kind === "channel";
  return { kinds, headerLine, firstMayBeTime };
}

function channel(name: string, unit: string, index: number): ColumnKind {
  const known = CHANNEL_UNITS[unit.toLowerCase()];
  const label = name === "" ? `CH${index + 1}` : /^\d+$/.test(name) ? `CH${name}` : name;
  if (known) return { kind: "channel", name: label, unit: known.unit, scale: known.scale };
  return unit === "" ? { kind: "channel", name: label, scale: 1 } : { kind: "channel", name: label, unit, scale: 1 };
}

function stripBrackets(text: string): string {
  return text.trim().replace(/^[([]\s*/, "").replace(/\s*[)\]]$/, "").trim();
}

function isUnitLike(field: string): boolean {
  const unit = stripBrackets(field).toLowerCase();
  return unit === "" || unit in TIME_SCALE || unit in CHANNEL_UNITS || INDEX_UNITS.has(unit) || OTHER_UNITS.has(unit);
}

type Rows = { count: number; columns: Float64Array[] };

/** One pass over the data block into typed arrays; the first bad line stops it with its number. */
function readRows(source: string, layout: Layout, columns: Columns): Rows {
  const { delimiter, decimalComma, width, skip } = layout;
  const capacity = countLines(source, layout.dataLine.start);
  const out = Array.from({ length: width }, () => new Float64Array(capacity));
  const len = source.length;
  let pos = layout.dataLine.start;
  let lineNumber = layout.dataLine.number;
  let count = 0;
  let footerFrom = -1;
  const timeColumn = columns.kinds.findIndex((k) => k.kind === "time" || k.kind === "index");
  const delimiterCode = delimiter.charCodeAt(0);
  const decimalCode = decimalComma ? 44 : 46;

  while (pos < len) {
    let end = source.indexOf("\n", pos);
    if (end === -1) end = len;
    let lineEnd = end;
    if (lineEnd > pos && source.charCodeAt(lineEnd - 1) === 13) lineEnd -= 1;
    if (!isBlank(source, pos, lineEnd)) {
      let fieldStart = pos;
      let ok = true;
      for (let k = 0; k < skip && ok; k += 1) {
        const d = source.indexOf(delimiter, fieldStart);
        if (d === -1 || d >= lineEnd) ok = false;
        else fieldStart = d + 1;
      }
      for (let col = 0; col < width && ok; col += 1) {
        const fast = scanNumber(source, fieldStart, lineEnd, decimalCode);
        if (fast === fast) {
          const stop = scanStop;
          const last = col === width - 1;
          if (last ? stop === lineEnd || onlyCharAfter(source, stop, lineEnd, delimiterCode) : stop < lineEnd && source.charCodeAt(stop) === delimiterCode) {
            out[col]![count] = fast;
            fieldStart = stop + 1;
            continue;
          }
        }
        let fieldEnd: number;
        if (col < width - 1) {
          const d = source.indexOf(delimiter, fieldStart);
          if (d === -1 || d >= lineEnd) { ok = false; break; }
          fieldEnd = d;
        } else {
          fieldEnd = lineEnd;
        }
        let raw = source.slice(fieldStart, fieldEnd);
        if (col === width - 1 && raw.indexOf(delimiter) !== -1) {
          raw = raw.replace(trailingDelimiters[delimiter], "");
          if (raw.indexOf(delimiter) !== -1) { ok = false; break; }
        }
        let value = parseNumber(raw, decimalComma);
        // A decimal comma first seen below the rows looked at for the layout.
        if (value !== value && !decimalComma && delimiter !== ",") value = parseNumber(raw, true);
        if (value !== value) { ok = false; break; }
        out[col]![count] = value;
        fieldStart = fieldEnd + 1;
      }
      if (!ok) {
        // Text after the last row (an instrument's footer) ends the data; a bad row among rows does not.
        if (footerFrom === -1 && (count === 0 || hasDigit(source, pos, lineEnd))) {
          throw badRow(source, pos, lineEnd, lineNumber, layout);
        }
        if (footerFrom === -1) footerFrom = lineNumber;
      } else if (footerFrom !== -1) {
        throw captureError(`Line ${lineNumber}: a row of samples after the text on line ${footerFrom}; the samples must form one block.`);
      } else {
        if (timeColumn >= 0 && count > 0) {
          const column = out[timeColumn]!;
          if (column[count]! < column[count - 1]!) {
            throw captureError(`Line ${lineNumber}: time goes backwards (${column[count - 1]}, then ${column[count]}); the time column must increase.`);
          }
        }
        count += 1;
      }
    }
    lineNumber += 1;
    pos = end + 1;
  }
  return { count, columns: out.map((c) => c.subarray(0, count)) };
}

const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);
let scanStop = 0;

/**
 * The fast path for plain decimal and scientific numbers: digits are gathered into an integer and
 * scaled once by an exact power of ten, which is correctly rounded while the integer has at most 15
 * digits and the power is at most 10^22 (Clinger's fast path) — the same double `Number()` gives.
 * Anything else returns NaN and the caller falls back to `Number()` on the field's text.
 */
function scanNumber(s: string, from: number, end: number, decimalCode: number): number {
  let i = from;
  let c = s.charCodeAt(i);
  while (c === 32 && i < end) c = s.charCodeAt(++i);
  let negative = false;
  if (c === 45 || c === 43) {
    negative = c === 45;
    c = s.charCodeAt(++i);
  }
  let mantissa = 0;
  let significant = 0;
  let fraction = 0;
  let digits = 0;
  while (i < end && c >= 48 && c <= 57) {
    if (significant > 0 || c !== 48) significant += 1;
    mantissa = mantissa * 10 + (c - 48);
    digits += 1;
    c = s.charCodeAt(++i);
  }
  if (c === decimalCode && i < end) {
    c = s.charCodeAt(++i);
    while (i < end && c >= 48 && c <= 57) {
      if (significant > 0 || c !== 48) significant += 1;
      mantissa = mantissa * 10 + (c - 48);
      fraction += 1;
      digits += 1;
      c = s.charCodeAt(++i);
    }
  }
  if (digits === 0 || significant > 15) return Number.NaN;
  let exponent = 0;
  if ((c === 101 || c === 69) && i < end) {
    c = s.charCodeAt(++i);
    let exponentNegative = false;
    if (c === 45 || c === 43) {
      exponentNegative = c === 45;
      c = s.charCodeAt(++i);
    }
    let exponentDigits = 0;
    while (i < end && c >= 48 && c <= 57) {
      exponent = exponent * 10 + (c - 48);
      exponentDigits += 1;
      c = s.charCodeAt(++i);
    }
    if (exponentDigits === 0 || exponentDigits > 4) return Number.NaN;
    if (exponentNegative) exponent = -exponent;
  }
  while (c === 32 && i < end) c = s.charCodeAt(++i);
  scanStop = i;
  const power = exponent - fraction;
  let value: number;
  if (power >= 0 && power <= 22) value = mantissa * POW10[power]!;
  else if (power < 0 && power >= -22) value = mantissa / POW10[-power]!;
  else return Number.NaN;
  if (value === Infinity) return Number.NaN;
  return negative ? -value : value;
}

function onlyCharAfter(s: string, from: number, end: number, code: number): boolean {
  for (let i = from; i < end; i += 1) {
    const c = s.charCodeAt(i);
    if (c !== code && c !== 32) return false;
  }
  return true;
}

function strictlyIncreasing(values: Float64Array): boolean {
  for (let i = 1; i < values.length; i += 1) if (!(values[i]! > values[i - 1]!)) return false;
  return values.length > 1;
}

const trailingDelimiters: Record<Delimiter, RegExp> = { "\t": /[\t\s]+$/, ";": /[;\s]+$/, ",": /[,\s]+$/ };

function countLines(source: string, from: number): number {
  let n = 1;
  let pos = source.indexOf("\n", from);
  while (pos !== -1) {
    n += 1;
    pos = source.indexOf("\n", pos + 1);
  }
  return n;
}

function isBlank(source: string, from: number, to: number): boolean {
  for (let i = from; i < to; i += 1) {
    const c = source.charCodeAt(i);
    if (c !== 32 && c !== 9 && c !== 44 && c !== 59) return false;
  }
  return true;
}

function hasDigit(source: string, from: number, to: number): boolean {
  for (let i = from; i < to; i += 1) {
    const c = source.charCodeAt(i);
    if (c >= 48 && c <= 57) return true;
  }
  return false;
}

function badRow(source: string, from: number, to: number, lineNumber: number, layout: Layout): EngineeringInputError {
  const { delimiter, decimalComma, skip } = layout;
  const width = layout.width + skip;
  const text = source.slice(from, to);
  const fields = splitFields(text, delimiter);
  const shown = text.length > 60 ? `${text.slice(0, 57)}…` : text;
  if (fields.length !== width) {
    return captureError(`Line ${lineNumber}: expected ${width} value${width === 1 ? "" : "s"} separated by ${DELIMITER_NAMES[delimiter]}, found ${fields.length} ("${shown}").`);
  }
  const column = fields.findIndex((f, i) => i >= skip && Number.isNaN(parseNumber(f, decimalComma)));
  const field = fields[column] ?? "";
  return captureError(
    `Line ${lineNumber}, column ${column + 1}: "${field}" is not a number${field === "" ? " (the value is missing)" : ""}.`,
  );
}

function assemble(rows: Rows, columns: Columns, meta: Metadata): ParsedCapture {
  const n = rows.count;
  if (columns.firstMayBeTime && strictlyIncreasing(rows.columns[0]!)) columns.kinds[0] = { kind: "time", scale: 1 };
  if (n < 2) throw captureError(`The capture holds ${n} sample${n === 1 ? "" : "s"}; at least two are needed.`);
  let timeS: Float64Array | null = null;
  const channels: CaptureChannel[] = [];
  columns.kinds.forEach((kind, i) => {
    const values = rows.columns[i]!;
    if (kind.kind === "time") {
      timeS = kind.scale === 1 ? values : values.map((v) => v * kind.scale);
    } else if (kind.kind === "index") {
      const dt = meta.intervalS!;
      timeS = values.map((x) => meta.startS + x * dt);
    } else {
      const scaled = kind.scale === 1 ? values : values.map((v) => v * kind.scale);
      channels.push(kind.unit === undefined ? { name: kind.name, values: scaled } : { name: kind.name, unit: kind.unit, values: scaled });
    }
  });
  if (timeS === null) {
    const dt = meta.intervalS!;
    const t = new Float64Array(n);
    for (let i = 0; i < n; i += 1) t[i] = meta.startS + i * dt;
    timeS = t;
  }
  const t: Float64Array = timeS;
  const span = t[n - 1]! - t[0]!;
  if (!(span > 0)) throw captureError("The time column does not advance: every sample has the same time.");
  for (const c of channels) {
    for (let i = 0; i < n; i += 1) {
      if (!Number.isFinite(c.values[i]!)) throw captureError(`Sample ${i + 1} of ${c.name} is too large to hold.`);
    }
  }
  return { timeS: t, channels, sampleIntervalS: span / (n - 1) };
}
