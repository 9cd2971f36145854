/**
 * A Map that holds at most `max` entries: setting a new key when it is full drops the oldest one first
 * (Maps iterate in insertion order, and setting a key again makes it the newest). The server's in-memory
 * caches are filled by what requests ask for, so each is bounded whatever the traffic.
 */
export class BoundedMap<K, V> extends Map<K, V> {
  readonly max: number;

  constructor(max: number) {
    super();
    if (!Number.isInteger(max) || max < 1) throw new RangeError(`a bounded map holds at least one entry (got ${max})`);
    this.max = max;
  }

  override set(key: K, value: V): this {
    this.delete(key);
    if (this.size >= this.max) this.delete(this.keys().next().value as K);
    return super.set(key, value);
  }
}
