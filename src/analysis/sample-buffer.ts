/**
 * Frequencies with the loop's value there, appended one at a time into typed
 * arrays that double when full: the grid builder's working storage. Each
 * typed array V8 allocates outside its heap costs microseconds and garbage
 * collector pressure, so the builder keeps its buffers between calls and
 * refining a grid allocates nothing per point.
 */
export class SampleBuffer {
  omega: Float64Array;
  re: Float64Array;
  im: Float64Array;
  length = 0;

  constructor(capacity: number) {
    const n = Math.max(16, capacity);
    this.omega = new Float64Array(n);
    this.re = new Float64Array(n);
    this.im = new Float64Array(n);
  }

  push(omega: number, re: number, im: number): void {
    if (this.length === this.omega.length) this.grow(2 * this.length);
    const i = this.length++;
    this.omega[i] = omega;
    this.re[i] = re;
    this.im[i] = im;
  }

  pop(): void {
    this.length--;
  }

  /** Empties the buffer, keeping room for at least `capacity` samples. */
  reset(capacity: number): void {
    this.length = 0;
    if (capacity > this.omega.length) this.grow(capacity);
  }

  private grow(capacity: number): void {
    const widen = (a: Float64Array) => {
      const b = new Float64Array(capacity);
      b.set(a.subarray(0, this.length));
      return b;
    };
    this.omega = widen(this.omega);
    this.re = widen(this.re);
    this.im = widen(this.im);
  }
}
