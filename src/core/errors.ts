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

/** "Did you mean …" suggestions live in didYouMean.ts; re-exported here, where the messages are built. */
export { closest, editDistance, unknownWithSuggestion } from "./didYouMean.js";
