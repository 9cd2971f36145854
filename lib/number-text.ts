/*
 * Numbers in the words of errors and limits, the same on the server and in the app. One formatter made
 * once: `toLocaleString('en-US')` builds a new one on every call (about 0.7 ms each), and the contracts
 * format some forty bounds while their module loads, on every page's start.
 */
const grouped = new Intl.NumberFormat('en-US', { maximumFractionDigits: 0 });

/** A whole count with thousands separators, rounded: 12,500. */
export const countText = (n: number): string => grouped.format(Math.round(n));

/** A bound as written in a range: whole numbers grouped (1,000), others to four decimals (0.008). */
export const boundText = (n: number): string =>
  Number.isInteger(n) ? countText(n) : String(Math.round(n * 1e4) / 1e4);
