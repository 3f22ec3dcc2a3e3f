/** Where a command writes and what it knows about its terminal; swapped for buffers in tests. */
export interface CliIo {
  stdout: (text: string) => void;
  stderr: (text: string) => void;
  /** working directory used to resolve relative paths */
  cwd: string;
  /** true when stdin and stdout are an interactive terminal */
  isTTY: boolean;
  /** terminal width for tables (80 when unknown) */
  columns: number;
}

export function processIo(): CliIo {
  return {
    stdout: (t) => process.stdout.write(t),
    stderr: (t) => process.stderr.write(t),
    cwd: process.cwd(),
    isTTY: process.stdin.isTTY === true && process.stdout.isTTY === true,
    columns: process.stdout.columns || 80,
  };
}

/** Collects output in strings, for tests. */
export function bufferIo(cwd = process.cwd()): CliIo & { out: () => string; err: () => string } {
  let out = "";
  let err = "";
  return {
    stdout: (t) => { out += t; },
    stderr: (t) => { err += t; },
    cwd,
    isTTY: false,
    columns: 80,
    out: () => out,
    err: () => err,
  };
}
