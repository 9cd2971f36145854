// Letters that read like digits are skipped (common practice for drawing revisions).
const LETTERS = 'ABCDEFGHJKLMNPRTUVWY';

/** A, B, … Y, then AA, AB, …: the letter after the highest one used so far. */
export function nextRevisionLetter(used: string[]): string {
  const index = (l: string) => [...l].reduce((n, ch) => n * LETTERS.length + LETTERS.indexOf(ch) + 1, 0);
  const top = used.reduce((m, l) => Math.max(m, index(l)), 0);
  let n = top + 1;
  let out = '';
  while (n > 0) {
    const r = (n - 1) % LETTERS.length;
    out = LETTERS[r] + out;
    n = Math.floor((n - 1) / LETTERS.length);
  }
  return out;
}
