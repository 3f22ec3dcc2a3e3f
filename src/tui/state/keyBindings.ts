/**
 * The session's keys, as one table: the help overlay lists it, the footer picks from it, and
 * `commandForKey` turns a key press into a command for the reducer. Pure (no ink): a key press is
 * described by the small `KeyLike` shape that ink's `useInput` also produces.
 */

export type ScreenId = "reduction" | "map" | "levels" | "flags";
export const SCREENS: readonly { id: ScreenId; title: string; key: string }[] = [
  { id: "reduction", title: "Reduction", key: "1" },
  { id: "map", title: "Map", key: "2" },
  { id: "levels", title: "Levels", key: "3" },
  { id: "flags", title: "Flags", key: "4" },
];

/** Where a binding applies: everywhere (no overlay open), on one screen, or inside an overlay. */
export type KeyScope = "global" | ScreenId | "picker" | "confirmQuit" | "help" | "notice";

export type CommandId =
  | "nextScreen"
  | "prevScreen"
  | "screenReduction"
  | "screenMap"
  | "screenLevels"
  | "screenFlags"
  | "help"
  | "quit"
  | "forceQuit"
  | "export"
  | "exportLayout"
  | "save"
  | "undo"
  | "togglePolarization"
  | "levelsUp"
  | "levelsDown"
  | "levelsAuto"
  | "applyRemedy"
  | "toleranceTighter"
  | "toleranceLooser"
  | "pickMaterials"
  | "pickFamilies"
  | "pickProcess"
  | "up"
  | "down"
  | "left"
  | "right"
  | "pageUp"
  | "pageDown"
  | "choose"
  | "nextQuantity"
  | "prevQuantity"
  | "worstCell"
  | "toggle"
  | "allowAll"
  | "close"
  | "confirmYes"
  | "confirmSave";

export interface KeyBinding {
  /** normalized key names (see `keyName`) */
  keys: string[];
  /** how the keys are shown in help and footer */
  label: string;
  /** what the key does, short */
  does: string;
  scope: KeyScope;
  command: CommandId;
}

/** Every key of the session. Screen and overlay bindings are checked before global ones. */
export const KEY_BINDINGS: readonly KeyBinding[] = [
  // everywhere
  { keys: ["tab"], label: "Tab", does: "next screen", scope: "global", command: "nextScreen" },
  { keys: ["S-tab"], label: "Shift+Tab", does: "previous screen", scope: "global", command: "prevScreen" },
  { keys: ["1"], label: "1", does: "Reduction screen: compare schemes", scope: "global", command: "screenReduction" },
  { keys: ["2"], label: "2", does: "Map screen: heat map and cell under the cursor", scope: "global", command: "screenMap" },
  { keys: ["3"], label: "3", does: "Levels screen: recipes, errors, runners-up", scope: "global", command: "screenLevels" },
  { keys: ["4"], label: "4", does: "Flags screen: flagged regions", scope: "global", command: "screenFlags" },
  { keys: ["p"], label: "p", does: "switch polarization (Ez ↔ Hz)", scope: "global", command: "togglePolarization" },
  { keys: ["+", "="], label: "+ / -", does: "one level more / fewer", scope: "global", command: "levelsUp" },
  { keys: ["-", "_"], label: "", does: "", scope: "global", command: "levelsDown" },
  { keys: ["a"], label: "a", does: "levels automatic: as few as the tolerance allows", scope: "global", command: "levelsAuto" },
  { keys: ["["], label: "[ / ]", does: "tolerance tighter / looser", scope: "global", command: "toleranceTighter" },
  { keys: ["]"], label: "", does: "", scope: "global", command: "toleranceLooser" },
  { keys: ["m"], label: "m", does: "choose the allowed materials", scope: "global", command: "pickMaterials" },
  { keys: ["f"], label: "f", does: "choose the allowed cell families", scope: "global", command: "pickFamilies" },
  { keys: ["b"], label: "b", does: "choose the fabrication process", scope: "global", command: "pickProcess" },
  { keys: ["u"], label: "u", does: "undo the last change of choices", scope: "global", command: "undo" },
  { keys: ["s"], label: "s", does: "save the choices (session file only)", scope: "global", command: "save" },
  { keys: ["e"], label: "e", does: "export build list, levels, report, summary, maps and session file", scope: "global", command: "export" },
  { keys: ["?"], label: "?", does: "show or hide this help", scope: "global", command: "help" },
  { keys: ["q", "C-c"], label: "q", does: "quit (asks first when choices are unsaved)", scope: "global", command: "quit" },
  // reduction
  { keys: ["up"], label: "↑ / ↓", does: "move along the scheme table", scope: "reduction", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "reduction", command: "down" },
  { keys: ["enter", "space"], label: "Enter", does: "use the scheme under the marker", scope: "reduction", command: "choose" },
  // map
  { keys: ["up"], label: "arrows", does: "move the cursor one map cell", scope: "map", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "map", command: "down" },
  { keys: ["left"], label: "", does: "", scope: "map", command: "left" },
  { keys: ["right"], label: "", does: "", scope: "map", command: "right" },
  { keys: ["."], label: ". / ,", does: "next / previous quantity on the map", scope: "map", command: "nextQuantity" },
  { keys: [","], label: "", does: "", scope: "map", command: "prevQuantity" },
  { keys: ["g"], label: "g", does: "go to the cell with the largest value of the quantity", scope: "map", command: "worstCell" },
  // levels
  { keys: ["up"], label: "↑ / ↓", does: "select a level", scope: "levels", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "levels", command: "down" },
  { keys: ["pageup"], label: "PgUp / PgDn", does: "page through the levels", scope: "levels", command: "pageUp" },
  { keys: ["pagedown"], label: "", does: "", scope: "levels", command: "pageDown" },
  { keys: ["enter"], label: "Enter", does: "show the selected level on the map", scope: "levels", command: "choose" },
  { keys: ["w"], label: "w", does: "apply the best remedy of \"what would help\" (tried by re-planning)", scope: "levels", command: "applyRemedy" },
  { keys: ["l"], label: "l", does: "export with the layout files for the fab (as plan --layout)", scope: "levels", command: "exportLayout" },
  // flags
  { keys: ["up"], label: "↑ / ↓", does: "select a flagged region", scope: "flags", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "flags", command: "down" },
  { keys: ["pageup"], label: "PgUp / PgDn", does: "page through the regions", scope: "flags", command: "pageUp" },
  { keys: ["pagedown"], label: "", does: "", scope: "flags", command: "pageDown" },
  { keys: ["enter"], label: "Enter", does: "jump to the region on the map", scope: "flags", command: "choose" },
  // picker overlay (materials, families, process)
  { keys: ["up"], label: "↑ / ↓", does: "move", scope: "picker", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "picker", command: "down" },
  { keys: ["space"], label: "Space", does: "allow / forbid the item (materials, families)", scope: "picker", command: "toggle" },
  { keys: ["a"], label: "a", does: "back to the design's own choice", scope: "picker", command: "allowAll" },
  { keys: ["enter"], label: "Enter", does: "apply and recompute", scope: "picker", command: "choose" },
  { keys: ["escape", "q"], label: "Esc", does: "cancel", scope: "picker", command: "close" },
  // quit confirmation
  { keys: ["y"], label: "y", does: "quit without saving", scope: "confirmQuit", command: "confirmYes" },
  { keys: ["s"], label: "s", does: "save the choices, then quit", scope: "confirmQuit", command: "confirmSave" },
  { keys: ["n", "escape", "q"], label: "n / Esc", does: "stay", scope: "confirmQuit", command: "close" },
  { keys: ["C-c"], label: "Ctrl+C", does: "quit at once", scope: "confirmQuit", command: "forceQuit" },
  // help and notices
  { keys: ["up"], label: "↑ / ↓", does: "scroll this help", scope: "help", command: "up" },
  { keys: ["down"], label: "", does: "", scope: "help", command: "down" },
  { keys: ["pageup"], label: "", does: "", scope: "help", command: "pageUp" },
  { keys: ["pagedown", "space"], label: "", does: "", scope: "help", command: "pageDown" },
  { keys: ["escape", "?", "q", "enter"], label: "Esc / ?", does: "close", scope: "help", command: "close" },
  { keys: ["escape", "enter", "space"], label: "Esc / Enter", does: "close", scope: "notice", command: "close" },
];

/** The parts of a key press the session reads (ink's `Key` has these fields). */
export interface KeyLike {
  upArrow?: boolean;
  downArrow?: boolean;
  leftArrow?: boolean;
  rightArrow?: boolean;
  pageUp?: boolean;
  pageDown?: boolean;
  return?: boolean;
  escape?: boolean;
  tab?: boolean;
  shift?: boolean;
  ctrl?: boolean;
  meta?: boolean;
}

/**
 * One name per key press: "up", "down", "left", "right", "pageup", "pagedown", "enter", "escape",
 * "tab", "S-tab", "space", "C-x" for Ctrl+x, or the typed character. Empty for keys we ignore.
 */
export function keyName(input: string, key: KeyLike): string {
  if (key.upArrow) return "up";
  if (key.downArrow) return "down";
  if (key.leftArrow) return "left";
  if (key.rightArrow) return "right";
  if (key.pageUp) return "pageup";
  if (key.pageDown) return "pagedown";
  if (key.return) return "enter";
  if (key.tab) return key.shift ? "S-tab" : "tab";
  if (key.escape) return "escape";
  if (key.ctrl && input.length === 1) return `C-${input.toLowerCase()}`;
  if (input === " ") return "space";
  if (input.length === 1) return input;
  return "";
}

/**
 * The command a key runs in a scope chain: the innermost scope first (an open overlay swallows
 * every other key), then the screen, then the global keys.
 */
export function commandForKey(name: string, overlay: KeyScope | null, screen: ScreenId): CommandId | null {
  // Ctrl+C always leaves: it asks first like q, and a second Ctrl+C at the question quits at once
  if (name === "C-c") return overlay === "confirmQuit" ? "forceQuit" : "quit";
  const scopes: KeyScope[] = overlay ? [overlay] : [screen, "global"];
  for (const scope of scopes) {
    const b = KEY_BINDINGS.find((k) => k.scope === scope && k.keys.includes(name));
    if (b) return b.command;
  }
  return null;
}

/** Help text lines: for each scope, the labelled bindings (continuation rows folded into the first). */
export function helpSections(): { title: string; rows: { label: string; does: string }[] }[] {
  const titles: Record<KeyScope, string> = {
    global: "Everywhere",
    reduction: "Reduction screen",
    map: "Map screen",
    levels: "Levels screen",
    flags: "Flags screen",
    picker: "Choosing materials, families or process",
    confirmQuit: "Quit with unsaved choices",
    help: "This help",
    notice: "Messages",
  };
  const order: KeyScope[] = ["global", "reduction", "map", "levels", "flags", "picker", "confirmQuit", "help"];
  return order.map((scope) => ({
    title: titles[scope],
    rows: KEY_BINDINGS.filter((b) => b.scope === scope && b.label !== "").map((b) => ({ label: b.label, does: b.does })),
  }));
}
