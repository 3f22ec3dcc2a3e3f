/** Bottom lines: the status or error message, and the keys that matter on this screen. */
import { Box, Text } from "ink";
import { KEY_BINDINGS, type KeyScope } from "../state/keyBindings.js";
import type { SessionState } from "../state/sessionState.js";
import { THEME } from "../theme.js";

const SHORT: Partial<Record<string, string>> = {
  up: "move",
  choose: "choose",
  nextQuantity: "quantity",
  worstCell: "largest",
  togglePolarization: "Ez/Hz",
  levelsUp: "levels",
  toleranceTighter: "tolerance",
  pickMaterials: "materials",
  pickFamilies: "families",
  pickProcess: "process",
  undo: "undo",
  export: "export",
  save: "save",
  help: "all keys",
  quit: "quit",
  toggle: "allow/forbid",
  allowAll: "design's choice",
  close: "close",
  confirmYes: "quit",
  confirmSave: "save+quit",
};

/** The short key hints for a scope chain, from the one key table. */
export function footerHints(scopes: KeyScope[]): string {
  const hints = (scope: KeyScope, pick: (c: string) => boolean): string[] =>
    KEY_BINDINGS.filter((b) => b.scope === scope && b.label && SHORT[b.command] && pick(b.command)).map((b) => `${b.label} ${SHORT[b.command]}`);
  const [own, ...rest] = scopes;
  // the screen's own keys, then help and quit (so a narrow terminal still shows them), then the rest
  const out = hints(own, () => true);
  for (const scope of rest) out.push(...hints(scope, (c) => c === "help" || c === "quit"));
  for (const scope of rest) out.push(...hints(scope, (c) => c !== "help" && c !== "quit"));
  return out.join("  ");
}

export function Footer({ state, width, scopes }: { state: SessionState; width: number; scopes: KeyScope[] }) {
  const message = state.planError
    ? { text: `${state.plan ? "the last change failed" : "no plan"}: ${state.planError}${state.history.length ? " (u undoes)" : ""}`, color: THEME.error }
    : state.status
      ? { text: state.status, color: THEME.accent }
      : { text: "", color: THEME.dim };
  return (
    <Box flexDirection="column" width={width}>
      <Text color={message.color} wrap="truncate-end">{message.text || " "}</Text>
      <Text color={THEME.dim} wrap="truncate-end">{footerHints(scopes)}</Text>
    </Box>
  );
}
