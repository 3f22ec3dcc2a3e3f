/**
 * Where a JSON text first goes wrong, for messages naming line:column. JSON.parse's own messages
 * differ between engines and some carry no position (a byte-order mark, a stray character after
 * the value), so this small scanner (RFC 8259 grammar, no values built) finds the offset itself.
 * Written here because the task is a few dozen lines and no npm parser reports a position for
 * every kind of mistake.
 */

export interface JsonSyntaxProblem {
  /** character offset of the first character that does not fit */
  offset: number;
  /** short lower-case description */
  message: string;
}

const MAX_DEPTH = 1000;

/** The first syntax problem in `text`, or null when it is valid JSON. */
export function findJsonProblem(text: string): JsonSyntaxProblem | null {
  let k = 0;
  const n = text.length;
  const fail = (message: string, at = k): never => { throw { offset: at, message } as JsonSyntaxProblem; };
  const describe = (at: number): string => {
    if (at >= n) return "unexpected end of the file";
    const ch = text[at];
    if (ch === "\uFEFF") return "unexpected byte-order mark";
    const code = ch.charCodeAt(0);
    return code < 32 ? `unexpected control character U+${code.toString(16).padStart(4, "0")}` : `unexpected '${ch}'`;
  };
  const ws = (): void => {
    while (k < n) {
      const c = text.charCodeAt(k);
      if (c === 32 || c === 9 || c === 10 || c === 13) k++;
      else break;
    }
  };
  const string = (): void => {
    k++; // opening quote
    while (k < n) {
      const c = text.charCodeAt(k);
      if (c === 34) { k++; return; }
      if (c === 92) {
        const e = text[k + 1];
        if (e === "u") {
          if (!/^[0-9a-fA-F]{4}$/.test(text.slice(k + 2, k + 6))) fail("bad \\u escape in a string", k);
          k += 6;
        } else if (e !== undefined && '"\\/bfnrt'.includes(e)) k += 2;
        else fail("bad escape in a string", k);
        continue;
      }
      if (c < 32) fail(c === 10 ? "a line break inside a string (missing closing quote?)" : "a control character inside a string");
      k++;
    }
    fail("unterminated string");
  };
  const number = (): void => {
    const m = /^-?(0|[1-9]\d*)(\.\d+)?([eE][+-]?\d+)?/.exec(text.slice(k, k + 400));
    if (!m || m[0] === "" || m[0] === "-") fail(describe(k));
    k += m![0].length;
  };
  const value = (depth: number): void => {
    if (depth > MAX_DEPTH) fail(`nesting deeper than ${MAX_DEPTH} levels`);
    ws();
    const ch = text[k];
    if (ch === "{") {
      k++; ws();
      if (text[k] === "}") { k++; return; }
      for (;;) {
        ws();
        if (text[k] !== '"') fail(text[k] === "}" ? "a comma before '}'" : `expected a double-quoted key, got ${describe(k).replace(/^unexpected /, "")}`);
        string(); ws();
        if (text[k] !== ":") fail(`expected ':' after the key, got ${describe(k).replace(/^unexpected /, "")}`);
        k++;
        value(depth + 1); ws();
        if (text[k] === ",") { k++; continue; }
        if (text[k] === "}") { k++; return; }
        fail(`expected ',' or '}', got ${describe(k).replace(/^unexpected /, "")}`);
      }
    }
    if (ch === "[") {
      k++; ws();
      if (text[k] === "]") { k++; return; }
      for (;;) {
        value(depth + 1); ws();
        if (text[k] === ",") { k++; continue; }
        if (text[k] === "]") { k++; return; }
        fail(`expected ',' or ']', got ${describe(k).replace(/^unexpected /, "")}`);
      }
    }
    if (ch === '"') return string();
    if (ch === "-" || (ch !== undefined && ch >= "0" && ch <= "9")) return number();
    for (const word of ["true", "false", "null"]) {
      if (text.startsWith(word, k)) { k += word.length; return; }
    }
    fail(describe(k));
  };
  try {
    value(0);
    ws();
    if (k < n) fail(`${describe(k)} after the end of the JSON value`);
    return null;
  } catch (err) {
    if (typeof err === "object" && err !== null && "offset" in err) return err as JsonSyntaxProblem;
    throw err;
  }
}
