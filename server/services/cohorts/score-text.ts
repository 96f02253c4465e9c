/**
 * Reads the score text of the facts query ("day isBaseline instrumentId value assessmentId", repeated,
 * space-separated) without splitting it into substrings: the export reads millions of these numbers, and the
 * substrings alone would be most of the garbage the server makes.
 */
export function forEachScore(
  text: string | null,
  visit: (day: number, isBaseline: boolean, instrumentId: number, value: number, assessmentId: number) => void,
): void {
  if (!text) return;
  const len = text.length;
  let pos = 0;
  const field = [0, 0, 0, 0, 0];
  let f = 0;
  while (pos < len) {
    // One decimal number as PostgreSQL prints integers and numerics: optional sign, digits, optional fraction.
    let sign = 1;
    if (text.charCodeAt(pos) === 45) {
      sign = -1;
      pos++;
    }
    let v = 0;
    let c = text.charCodeAt(pos);
    while (c >= 48 && c <= 57) {
      v = v * 10 + (c - 48);
      c = text.charCodeAt(++pos);
    }
    if (c === 46) {
      let scale = 1;
      c = text.charCodeAt(++pos);
      while (c >= 48 && c <= 57) {
        v = v * 10 + (c - 48);
        scale *= 10;
        c = text.charCodeAt(++pos);
      }
      v /= scale;
    }
    if (pos < len && c !== 32) throw new Error(`unexpected character in score text at ${pos}`);
    field[f++] = sign * v;
    pos++;
    if (f === 5) {
      visit(field[0]!, field[1] === 1, field[2]!, field[3]!, field[4]!);
      f = 0;
    }
  }
}
