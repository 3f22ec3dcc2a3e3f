/**
 * A numerical non-answer raised to the shell: the computation ran on valid input and found no
 * trustworthy answer (a zero pivot, an overflow). Not the user's input error and not a bug in the
 * caller's contract: the command says where and why, and the case is reported as not computed.
 */
export class NumericalFailure extends Error {
  /** where: "verify solver" */
  readonly where: string;
  /** node id (grid unknown) where it happened, −1 when not tied to one */
  readonly unknown: number;
  constructor(where: string, reason: string, unknown = -1) {
    super(reason);
    this.name = "NumericalFailure";
    this.where = where;
    this.unknown = unknown;
  }
}
