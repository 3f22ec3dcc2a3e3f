/**
 * Texts made once for the build list (per lattice index, level, region, flag mask), kept in one
 * pool of 8-byte words: each text starts on a word and is copied into a row eight bytes at a time
 * (up to seven bytes past its end are written too; the next field, or the buffer's slack, takes
 * them). One pool instead of an object and a typed array per text: a row then reads its texts
 * from two index arrays and one word array, where small typed arrays scattered over the heap
 * cost a dependent load chain (array → object → typed array → backing store) per text, each
 * missing the cache as the lattice index moves on.
 *
 * Texts are printable ASCII and line breaks (catalog ids, numbers, flag names): a word of such
 * bytes has a high byte ≤ 0x7e, so it is never a NaN bit pattern and a float load and store keep
 * it exactly.
 */

/**
 * Whether this machine stores numbers little-endian: a word read from `words` (host order) is
 * written back with `DataView.setFloat64(at, word, HOST_LITTLE_ENDIAN)` to keep its bytes in order.
 */
export const HOST_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** The pool: text `id` is `length[id]` bytes from word `start[id]` of `words` (host byte order). */
export interface TextPool {
  words: Float64Array;
  start: Int32Array;
  length: Int32Array;
}

/** Lowest and highest byte a pooled text may hold besides the line break (printable ASCII). */
const FIRST_PRINTABLE = 0x20, LAST_PRINTABLE = 0x7e, LINE_BREAK = 0x0a;

/** A pool of `texts` (ids are their positions); throws on a byte other than printable ASCII and line breaks. */
export function makeTextPool(texts: readonly Uint8Array[]): TextPool {
  const start = new Int32Array(texts.length);
  const length = new Int32Array(texts.length);
  let words = 0;
  for (let id = 0; id < texts.length; id++) {
    const t = texts[id];
    for (let k = 0; k < t.length; k++) {
      if ((t[k] < FIRST_PRINTABLE || t[k] > LAST_PRINTABLE) && t[k] !== LINE_BREAK) throw new Error(`build-list text ${JSON.stringify(new TextDecoder().decode(t))} holds byte ${t[k]} outside printable ASCII`);
    }
    start[id] = words;
    length[id] = t.length;
    words += (t.length + 7) >> 3;
  }
  const bytes = new Uint8Array(8 * Math.max(1, words));
  for (let id = 0; id < texts.length; id++) bytes.set(texts[id], 8 * start[id]);
  return { words: new Float64Array(bytes.buffer), start, length };
}

/** The bytes of text `id` (the tests read the pool through it). */
export function poolText(pool: TextPool, id: number): Uint8Array {
  return new Uint8Array(pool.words.buffer, 8 * pool.start[id], pool.length[id]);
}
