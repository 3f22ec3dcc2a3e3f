/**
 * One terminal read can hold several key presses: keys typed faster than the session redraws (a
 * burst of `+++`, or keys that queued while the event loop was busy) arrive as one chunk, and ink's
 * `useInput` hands a run of plain characters over as one string. `keyNames` splits such a chunk
 * back into the key presses it holds, in order, so none is dropped. ink already cuts escape
 * sequences (arrows, PgUp, …) out of a chunk and hands each over whole with its `key` flags; those
 * stay one key. Pure (no ink).
 */
import { keyName, type KeyLike } from "./keyBindings.js";

/** The name of one control or plain character read on its own (see `keyName`); "" when ignored. */
function charName(ch: string): string {
  const code = ch.codePointAt(0) ?? 0;
  if (ch === "\r" || ch === "\n") return "enter";
  if (ch === "\t") return "tab";
  if (ch === "\u001B") return "escape";
  if (ch === " ") return "space";
  if (code === 0x7f || code === 0x08) return ""; // backspace: no binding
  if (code >= 1 && code <= 26) return `C-${String.fromCharCode(code + 96)}`;
  if (code < 0x20) return "";
  return ch;
}

/**
 * Every key press in one input event, in the order typed: `keyName` for a single key (an escape
 * sequence, Enter, Tab, Ctrl+x or one character), else one name per character of the chunk.
 * Example: `keyNames("+]+", {})` → `["+", "]", "+"]`; `keyNames("", { upArrow: true })` → `["up"]`.
 */
export function keyNames(input: string, key: KeyLike): string[] {
  const special = key.upArrow || key.downArrow || key.leftArrow || key.rightArrow || key.pageUp || key.pageDown || key.escape || key.tab;
  const chars = [...input];
  if (special || chars.length <= 1) {
    const one = keyName(input, key);
    return one === "" ? [] : [one];
  }
  // ink flags a chunk "return" or "meta" only when it is that one key; a longer chunk is plain text
  const out: string[] = [];
  for (const ch of chars) {
    const name = charName(ch);
    if (name !== "") out.push(name);
  }
  return out;
}
