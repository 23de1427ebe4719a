// The capture file's bytes as text. Instruments write UTF-8 or, on older Windows-based scopes, the
// Windows-1252 ("ANSI") code page; the two differ exactly where headers carry units such as "µs"
// (U+00B5: C2 B5 in UTF-8, B5 alone in Windows-1252). Reading an ANSI "µs" as UTF-8 would turn it
// into U+FFFD and the time unit would be lost, so invalid UTF-8 is read as Windows-1252 instead.

// Bytes 80–9F of Windows-1252 (WHATWG Encoding Standard, index-windows-1252); the rest are Latin-1.
// Written out because Node's TextDecoder reads the "windows-1252" label as plain Latin-1.
const HIGH_1252 = "€\u0081‚ƒ„…†‡ˆ‰Š‹Œ\u008dŽ\u008f\u0090‘’“”•–—˜™š›œ\u009džŸ";

function decode1252(bytes: Uint8Array): string {
  const latin1 = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("latin1");
  return latin1.replace(/[\u0080-\u009f]/g, (c) => HIGH_1252[c.charCodeAt(0) - 0x80] ?? c);
}

export function decodeCaptureText(bytes: Uint8Array): string {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return decode1252(bytes);
  }
}
