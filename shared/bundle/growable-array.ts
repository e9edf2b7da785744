type TypedArrayConstructor<T> = { new (length: number): T; BYTES_PER_ELEMENT: number };
type NumericArray = Float64Array | Float32Array | Int32Array;

/**
 * Append-only typed array that doubles its capacity, so tables of unknown length are built
 * without per-row objects; `toArray()` returns an exact-length copy and frees the buffer.
 */
export class GrowableArray<T extends NumericArray> {
  private buffer: T;
  length = 0;

  constructor(
    private readonly ctor: TypedArrayConstructor<T>,
    initialCapacity = 1024,
  ) {
    this.buffer = new ctor(initialCapacity);
  }

  push(value: number): void {
    if (this.length === this.buffer.length) this.grow(this.length + 1);
    this.buffer[this.length++] = value;
  }

  /** Appends many values at once (a whole scan). */
  pushAll(values: ArrayLike<number>): void {
    if (this.length + values.length > this.buffer.length) this.grow(this.length + values.length);
    for (let k = 0; k < values.length; k++) this.buffer[this.length + k] = values[k];
    this.length += values.length;
  }

  toArray(): T {
    const exact = this.buffer.slice(0, this.length) as T;
    this.buffer = new this.ctor(0);
    return exact;
  }

  private grow(minimum: number): void {
    let capacity = Math.max(16, this.buffer.length * 2);
    while (capacity < minimum) capacity *= 2;
    const next = new this.ctor(capacity);
    next.set(this.buffer as never);
    this.buffer = next;
  }
}
