/**
 * Storage reused by repeated tensor-field computations (the tensor engine's output arrays and the
 * grid's index arrays), so a second computation writes into memory that is already mapped.
 *
 * Why: a fresh typed array is zeroed memory the operating system maps page by page on first write.
 * At 10⁶ cells the engine writes about 40 MB of fresh arrays, and on a virtual machine whose host
 * takes freed memory back each 4 KiB page fault costs 14–16 µs of CPU: more than the arithmetic of
 * all cells together. A caller that computes fields again and again (a benchmark, a search over
 * pitches) passes one `FieldBuffers` to every call.
 *
 * Contract: a field computed with buffers holds views into them, so it is valid only until the
 * next computation with the same buffers. Buffers grow to the largest request and never shrink.
 */

export interface FieldBuffers {
  /** `n` doubles in the buffer named `name`; zero-filled when `zeroed`, otherwise unspecified. */
  f64(name: string, n: number, zeroed: boolean): Float64Array;
  /** `n` 32-bit integers, as `f64`. */
  i32(name: string, n: number, zeroed: boolean): Int32Array;
  /** `n` bytes, as `f64`. */
  u8(name: string, n: number, zeroed: boolean): Uint8Array;
}

/** New, empty buffers (nothing is allocated until the first computation). */
export function fieldBuffers(): FieldBuffers {
  const store = new Map<string, ArrayBuffer>();
  const bytes = (name: string, size: number): ArrayBuffer => {
    let b = store.get(name);
    if (!b || b.byteLength < size) { b = new ArrayBuffer(size); store.set(name, b); }
    return b;
  };
  return {
    f64(name, n, zeroed) { const a = new Float64Array(bytes(name, 8 * n), 0, n); if (zeroed) a.fill(0); return a; },
    i32(name, n, zeroed) { const a = new Int32Array(bytes(name, 4 * n), 0, n); if (zeroed) a.fill(0); return a; },
    u8(name, n, zeroed) { const a = new Uint8Array(bytes(name, n), 0, n); if (zeroed) a.fill(0); return a; },
  };
}
