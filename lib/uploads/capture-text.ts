// A capture is stored as given and later read as text (lib/engineering/capture-csv.ts): oscilloscope
// exports are CSV, tab- or semicolon-separated text. So a file on the capture route must be text:
//   - no NUL byte anywhere (the rule git uses to call a file binary, applied to the whole file; it
//     also refuses UTF-16 exports, which the capture reader cannot take either);
//   - hardly any other C0 control characters (HT, LF, VT, FF, CR are text; a DOS end-of-file
//     Ctrl-Z at the very end is tolerated) — common practice for telling text from binary.
// And because reviewers download the raw file and may open it in a spreadsheet, a field that a
// spreadsheet would run as a formula (OWASP "CSV Injection": a cell starting with =, @, or + / -
// followed by a function call or a DDE "cmd|" link) is refused rather than stored.

export type CaptureTextVerdict = { ok: true } | { ok: false; reason: string };

// Above one control byte per 10 000 the file is not text that an instrument wrote.
const MAX_CONTROL_RATIO = 1e-4;

function isTextControl(byte: number): boolean {
  return byte === 0x09 || byte === 0x0a || byte === 0x0b || byte === 0x0c || byte === 0x0d;
}

// A field (after the separator and optional quote/space) that starts like a formula.
const FORMULA_FIELD = /(?:^|[,;\t])[ "']*(?:[=@][^,;\t\r\n]*[A-Za-z(]|[+-][^,;\t\r\n]*(?:[A-Za-z]+\(|\|))/m;

export function checkCaptureText(bytes: Uint8Array): CaptureTextVerdict {
  let controls = 0;
  const end = bytes[bytes.length - 1] === 0x1a ? bytes.length - 1 : bytes.length;
  for (let i = 0; i < end; i++) {
    const byte = bytes[i]!;
    if (byte === 0) return { ok: false, reason: "it holds binary data, not text; export the capture as CSV or tab-separated text" };
    if (byte < 0x20 && !isTextControl(byte)) controls++;
    if (byte === 0x7f) controls++;
  }
  if (controls > Math.max(0, end * MAX_CONTROL_RATIO)) {
    return { ok: false, reason: "it holds binary data, not text; export the capture as CSV or tab-separated text" };
  }
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("latin1");
  const formula = FORMULA_FIELD.exec(text);
  if (formula) {
    return { ok: false, reason: "it contains a spreadsheet formula, which a spreadsheet could run when a reviewer opens the file" };
  }
  return { ok: true };
}
