/** Bottom lines: the status or error message, and the keys that matter on this screen. */
import { Box, Text } from "ink";
import { footerLine } from "../state/footerHints.js";
import type { KeyScope } from "../state/keyBindings.js";
import type { SessionState } from "../state/sessionState.js";
import { THEME } from "../theme.js";

export function Footer({ state, width, scopes }: { state: SessionState; width: number; scopes: KeyScope[] }) {
  const message = state.planError
    ? { text: `${state.plan ? "the last change failed" : "no plan"}: ${state.planError}${state.history.length ? " (u undoes)" : ""}`, color: THEME.error }
    : state.status
      ? { text: state.status, color: THEME.accent }
      : { text: "", color: THEME.dim };
  return (
    <Box flexDirection="column" width={width}>
      <Text color={message.color} wrap="truncate-end">{message.text || " "}</Text>
      <Text color={THEME.dim} wrap="truncate-end">{footerLine(scopes, width)}</Text>
    </Box>
  );
}
