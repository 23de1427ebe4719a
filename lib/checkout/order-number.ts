// Order numbers a buyer can read out on the phone: date and six characters without look-alikes.
const ALPHABET = "ABCDEFGHJKLMNPQRSTUVWXYZ23456789";

/** e.g. FY-20261104-K7QM3D; `random` supplies the bytes (crypto in the app, fixed in tests). */
export function orderNumber(at: Date, random: (n: number) => Uint8Array): string {
  const date = at.toISOString().slice(0, 10).replaceAll("-", "");
  const code = [...random(6)].map((b) => ALPHABET[b % ALPHABET.length]).join("");
  return `FY-${date}-${code}`;
}
