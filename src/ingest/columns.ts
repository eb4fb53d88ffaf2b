/** Growable typed columns, so large tables keep no object per row. */
export class GrowableFloat64 {
  data: Float64Array;
  length = 0;
  constructor(capacity = 1024) {
    this.data = new Float64Array(capacity);
  }
  push(value: number): void {
    if (this.length === this.data.length) {
      const grown = new Float64Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    this.data[this.length++] = value;
  }
  /** The filled part, trimmed to its length (a copy, so the spare capacity is released). */
  done(): Float64Array {
    return this.data.slice(0, this.length);
  }
}

export class GrowableInt32 {
  data: Int32Array;
  length = 0;
  constructor(capacity = 1024) {
    this.data = new Int32Array(capacity);
  }
  push(value: number): void {
    if (this.length === this.data.length) {
      const grown = new Int32Array(this.data.length * 2);
      grown.set(this.data);
      this.data = grown;
    }
    this.data[this.length++] = value;
  }
  done(): Int32Array {
    return this.data.slice(0, this.length);
  }
}

/**
 * One bit per (item, month) over a fixed span of months, to spot a repeated row without a key
 * string per row. Months outside the span are refused by the caller before they get here.
 */
export class SeenBits {
  private readonly bits: Uint8Array;
  constructor(
    private readonly items: number,
    private readonly firstMonth: number,
    private readonly months: number,
  ) {
    this.bits = new Uint8Array(Math.ceil((items * months) / 8));
  }
  /** Marks (item, month) and says whether it was marked before. */
  testAndSet(item: number, month: number): boolean {
    const bit = item * this.months + (month - this.firstMonth);
    const byte = bit >>> 3;
    const mask = 1 << (bit & 7);
    const seen = ((this.bits[byte] as number) & mask) !== 0;
    this.bits[byte] = (this.bits[byte] as number) | mask;
    return seen;
  }
  get size(): number {
    return this.items;
  }
}
