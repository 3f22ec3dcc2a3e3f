/**
 * The key hints of the footer line, fitted to the terminal's width. Keys come from the one key
 * table (keyBindings.ts); this file only says which commands the footer shows, in which order of
 * importance, and with which short word. When the line is too long, words and the least used
 * hints go first (see `footerLine`): the most used keys — the screen's own, levels, tolerance,
 * undo, save, export, help and quit — stay visible at 80 columns. Pure.
 */
import { KEY_BINDINGS, type CommandId, type KeyScope } from "./keyBindings.js";

/** Commands the footer shows, most important first, with their short word. */
const FOOTER_ORDER: readonly { command: CommandId; word: string }[] = [
  // the screen's or overlay's own keys
  { command: "up", word: "move" },
  { command: "choose", word: "choose" },
  { command: "exportLayout", word: "layout" },
  { command: "toggle", word: "allow/forbid" },
  { command: "nextQuantity", word: "quantity" },
  { command: "worstCell", word: "largest" },
  { command: "confirmYes", word: "quit" },
  { command: "confirmSave", word: "save+quit" },
  { command: "close", word: "close" },
  { command: "allowAll", word: "design's choice" },
  // everywhere: the choices and the writes, then help and quit
  { command: "levelsUp", word: "levels" },
  { command: "toleranceTighter", word: "tolerance" },
  { command: "undo", word: "undo" },
  { command: "save", word: "save" },
  { command: "export", word: "export" },
  { command: "help", word: "keys" },
  { command: "quit", word: "quit" },
  { command: "togglePolarization", word: "Ez/Hz" },
  { command: "pickMaterials", word: "materials" },
  { command: "pickFamilies", word: "families" },
  { command: "pickProcess", word: "process" },
];

/** Hints that stay while any other hint can still go: the screen's own keys and the most used. */
const KEEP: ReadonlySet<CommandId> = new Set(["up", "choose", "exportLayout", "toggle", "nextQuantity", "worstCell", "confirmYes", "confirmSave", "close", "levelsUp", "toleranceTighter", "undo", "save", "export", "help", "quit"]);
/** Words of kept hints in the order they go when even the kept hints do not fit with words. */
const WORD_DROP: readonly CommandId[] = ["up", "choose", "exportLayout", "quit", "worstCell", "nextQuantity", "help", "allowAll", "close", "toggle", "toleranceTighter", "levelsUp", "export", "save", "undo", "confirmSave", "confirmYes"];

export interface FooterHint {
  /** the key as shown ("u", "+/-", "↑/↓") */
  key: string;
  word: string;
  command: CommandId;
}

/** The footer's hints for a scope chain (innermost first), most important first. */
export function footerHintList(scopes: KeyScope[]): FooterHint[] {
  const out: FooterHint[] = [];
  for (const { command, word } of FOOTER_ORDER) {
    for (const scope of scopes) {
      const b = KEY_BINDINGS.find((k) => k.scope === scope && k.command === command && k.label !== "");
      if (!b) continue;
      if (!out.some((h) => h.key === b.label.replace(/ \/ /g, "/"))) out.push({ key: b.label.replace(/ \/ /g, "/"), word, command });
      break;
    }
  }
  return out;
}

function lineOf(hints: FooterHint[], withWord: boolean[]): string {
  return hints.map((h, k) => (withWord[k] ? `${h.key} ${h.word}` : h.key)).join("  ");
}

/**
 * The footer line for `width` characters: every hint with its word when it fits; else, in turn
 * until it fits, the words of the less used hints (least important first), those hints
 * themselves (their keys stay in the help), and the words of the kept hints (`WORD_DROP` order).
 * A line that still does not fit is cut by the caller.
 * Example: at 80 columns the Levels screen shows
 * "↑/↓  Enter  +/- levels  [/] tolerance  u undo  s save  e export  ? keys  q quit".
 */
export function footerLine(scopes: KeyScope[], width: number): string {
  let hints = footerHintList(scopes);
  let withWord = hints.map(() => true);
  const fits = (): boolean => [...lineOf(hints, withWord)].length <= width;
  for (let k = hints.length - 1; k >= 0 && !fits(); k--) if (!KEEP.has(hints[k].command)) withWord[k] = false;
  for (let k = hints.length - 1; k >= 0 && !fits(); k--) {
    if (KEEP.has(hints[k].command)) continue;
    hints = hints.filter((_, q) => q !== k);
    withWord = withWord.filter((_, q) => q !== k);
  }
  for (const command of WORD_DROP) {
    if (fits()) break;
    const k = hints.findIndex((h) => h.command === command);
    if (k >= 0) withWord[k] = false;
  }
  return lineOf(hints, withWord);
}
