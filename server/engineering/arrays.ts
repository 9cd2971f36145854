/**
 * `n` copies of `value` in an array V8 keeps packed, made at its size. `new Array(n)` makes a holey
 * array, and it stays holey however it is filled: in optimised code a read from a holey array of numbers
 * may be the hole, so the value read is boxed (a heap allocation each time), which in the schedules'
 * loops was some 30,000 allocations a study. Filling by push instead grows the array several times over.
 * A copy of a packed array of numbers is packed and made at its size: copies of one kept here.
 */
let template: number[] = [0.5];

export function packed(n: number, value: number): number[] {
  return room(n).fill(value);
}

/** A packed array of `n` numbers for a caller that writes every one of them (it holds 0.5 until then). */
export function room(n: number): number[] {
  if (template.length < n) {
    const grown = template.slice();
    while (grown.length < n) grown.push(0.5);
    template = grown;
  }
  return template.slice(0, n);
}
