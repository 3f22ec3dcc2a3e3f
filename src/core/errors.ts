/**
 * Error types shared by the whole code base.
 *
 * - `InputIssue`/`InputError`: problems in what the user gave us (design JSON, CSV rows, flags).
 *   Issues are collected with their place (file, line, column or JSON path) and shown all at once.
 * - `ProgrammerError`: a broken contract inside the code (wrong array length, unknown registry id
 *   passed by code). Never caused by user data.
 * Numerical non-answers (folded map, no convergence) are not errors: they come back as values or
 * per-cell flags.
 */
export interface InputIssue {
  /** Where: "design.json: $.grid.pitch", "field.csv:12:3", "--frequency". */
  where: string;
  /** What was expected or what is wrong, a short lower-case fragment. */
  message: string;
}

export class InputError extends Error {
  readonly issues: InputIssue[];
  constructor(issues: InputIssue[] | InputIssue) {
    const list = Array.isArray(issues) ? issues : [issues];
    super(list.map((i) => `${i.where}: ${i.message}`).join("\n"));
    this.name = "InputError";
    this.issues = list;
  }
}

export class ProgrammerError extends Error {
  readonly data: unknown;
  constructor(message: string, data?: unknown) {
    super(message);
    this.name = "ProgrammerError";
    this.data = data;
  }
}

/** Throw an InputError for one place. */
export function inputError(where: string, message: string): never {
  throw new InputError({ where, message });
}

/** Levenshtein distance, for "did you mean" suggestions. */
export function editDistance(a: string, b: string): number {
  const m = a.length;
  const n = b.length;
  let prev = new Array<number>(n + 1);
  let cur = new Array<number>(n + 1);
  for (let j = 0; j <= n; j++) prev[j] = j;
  for (let i = 1; i <= m; i++) {
    cur[0] = i;
    for (let j = 1; j <= n; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      cur[j] = Math.min(prev[j] + 1, cur[j - 1] + 1, prev[j - 1] + cost);
    }
    [prev, cur] = [cur, prev];
  }
  return prev[n];
}

/** Up to `count` candidates closest to `word`, for "did you mean …" in messages. */
export function closest(word: string, candidates: readonly string[], count = 3): string[] {
  const w = word.toLowerCase();
  return [...candidates]
    .map((c) => ({ c, d: editDistance(w, c.toLowerCase()) - (c.toLowerCase().includes(w) ? 2 : 0) }))
    .sort((x, y) => x.d - y.d || x.c.localeCompare(y.c))
    .slice(0, count)
    .map((x) => x.c);
}

/** "unknown material 'ptf'; did you mean ptfe, pla?" */
export function unknownWithSuggestion(kind: string, word: string, candidates: readonly string[]): string {
  const near = closest(word, candidates);
  return near.length
    ? `unknown ${kind} '${word}'; did you mean ${near.join(", ")}?`
    : `unknown ${kind} '${word}'`;
}
