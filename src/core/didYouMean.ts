/**
 * "Did you mean …" for a mistyped id, option, key or command: which of the known names the user
 * most likely meant, best first.
 *
 * A known name is *related* to the typed word when, letter case and leading dashes aside, one of
 * these holds (k = the typos allowed, max(1, ⌊length of the typed word / 3⌋)):
 *   - the whole name is within k edits of the word ("fused-silca" → fused-silica);
 *   - a run of its '-'/'_'-separated words is within k edits ("fused-silca" → fused-silica-optical,
 *     whose first two words are "fused-silica"; "silica" → fused-silica);
 *   - one is the other's beginning, the shorter at least 3 letters ("fused" → fused-silica,
 *     "--output" → --out).
 * Related names are ranked by their closest form: the whole name at its edit count, a name that
 * starts with the word at ½, a run of its first words at its edit count + ½, a run further in at
 * its edit count + 1, a name the word starts with at its whole edit count + ½ (a plain typo of a
 * whole name first, then longer names that start the same way, then names that only contain it);
 * ties by the whole name's edit count, then alphabetically.
 * A name that is not related is never offered: when none is, a short list (at most
 * LIST_ALL_UP_TO names, e.g. the material classes) is given whole instead, a longer one not at all.
 * Edits are the optimal-string-alignment distance (insert, delete, substitute, swap two adjacent
 * letters: Damerau, "A technique for computer detection and correction of spelling errors",
 * Comm. ACM 7(3), 171 (1964)), so "levles" is one edit from "levels".
 * Cost: O(names × runs × |word| × |name|) — a few thousand cells per name; messages only.
 */

/**
 * Optimal-string-alignment edit distance: insertions, deletions, substitutions and transpositions
 * of adjacent characters, each 1 (no substring edited twice). Example: editDistance("levles", "levels") → 1.
 */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  let prev2 = new Array<number>(n + 1).fill(0);
  let prev = new Array<number>(n + 1);
  let cur = new Array<number>(n + 1);
  for (let j = 0; j <= n; j++) prev[j] = j;
  for (let i = 1; i <= m; i++) {
    cur[0] = i;
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let d = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d = Math.min(d, prev2[j - 2] + 1);
      cur[j] = d;
    }
    [prev2, prev, cur] = [prev, cur, prev2];
  }
  return prev[n];
}

/** Lower case, leading dashes off ("--Levels" → "levels"). */
function core(s: string): string {
  return s.toLowerCase().replace(/^-+/, "");
}

/** How close `name` is to the typed `word` (both `core`d): rank score and whether it is related. */
function closeness(word: string, name: string, allowed: number): { score: number; whole: number; related: boolean } {
  const whole = editDistance(word, name);
  let score = whole;
  let related = whole <= allowed;
  const shorter = Math.min(word.length, name.length);
  if (shorter >= 3 && name.startsWith(word)) {
    related = true;
    score = Math.min(score, 0.5);
  } else if (shorter >= 3 && word.startsWith(name)) {
    // the word goes on past the name ("--output" → --out): after any name the word is a typo of
    related = true;
    score = Math.min(score, whole + 0.5);
  }
  // runs of whole words: from word i to word j (not the whole name, counted above)
  const words = [...name.matchAll(/[^-_]+/g)].map((m) => ({ start: m.index!, end: m.index! + m[0].length }));
  for (let i = 0; i < words.length; i++) {
    for (let j = i; j < words.length; j++) {
      if (i === 0 && j === words.length - 1) continue;
      const run = name.slice(words[i].start, words[j].end);
      // a run much shorter or longer than the word cannot be within the allowed edits
      if (Math.abs(run.length - word.length) > allowed) continue;
      const d = editDistance(word, run);
      if (d <= allowed) {
        related = true;
        score = Math.min(score, d + (i === 0 ? 0.5 : 1));
      }
    }
  }
  return { score, whole, related };
}

/** Up to `count` of `candidates` the user most likely meant by `word`, best first (see file comment). */
export function closest(word: string, candidates: readonly string[], count = 3): string[] {
  const w = core(word);
  const allowed = Math.max(1, Math.floor(w.length / 3));
  const scored = candidates.map((c) => ({ c, ...closeness(w, core(c), allowed) }));
  return scored
    .filter((x) => x.related)
    .sort((x, y) => x.score - y.score || x.whole - y.whole || x.c.localeCompare(y.c))
    .slice(0, count)
    .map((x) => x.c);
}

/** Names listed whole when none is related to the typed word. */
export const LIST_ALL_UP_TO = 10;

/**
 * "unknown material 'ptf'; did you mean ptfe, ptfe-glass, ptfe-ceramic-3?"; with no related name,
 * "unknown class 'plastic'; expected one of polymer, resin, …" for a short list, else "unknown material 'xyz'".
 */
export function unknownWithSuggestion(kind: string, word: string, candidates: readonly string[]): string {
  const near = closest(word, candidates);
  if (near.length) return `unknown ${kind} '${word}'; did you mean ${near.join(", ")}?`;
  if (candidates.length > 0 && candidates.length <= LIST_ALL_UP_TO) return `unknown ${kind} '${word}'; expected one of ${candidates.join(", ")}`;
  return `unknown ${kind} '${word}'`;
}
