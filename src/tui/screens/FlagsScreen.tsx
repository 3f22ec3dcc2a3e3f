/**
 * Flags screen: every flag that occurs, with the regions where it occurs (largest first); the
 * selected row is marked › (and inverted). Enter jumps to the map showing that flag, cursor on
 * the region.
 */
import { Box, Text } from "ink";
import { flagRegionRows } from "../state/flagRegions.js";
import { scrollStart } from "../state/scrollWindow.js";
import type { SessionState } from "../state/sessionState.js";
import { THEME, fit } from "../theme.js";

function flagTitle(n: number): string {
  return `Flagged cells by region (${n} flag${n === 1 ? "" : "s"} occur${n === 1 ? "s" : ""}; Enter shows one on the map)`;
}

export function FlagsScreen({ state, width, height }: { state: SessionState; width: number; height: number }) {
  const plan = state.plan;
  if (!plan) return <Text color={THEME.dim}>waiting for the first plan…</Text>;
  const rows = flagRegionRows(plan);
  if (rows.length === 0) return <Text color={THEME.ok}>no cell carries a flag</Text>;
  const listRows = Math.max(3, height - 2);
  const start = scrollStart(state.flagCursor, rows.length, listRows);
  const current = rows[state.flagCursor];
  return (
    <Box flexDirection="column" height={height}>
      <Text bold>{flagTitle(rows.filter((r) => r.region === null).length)}</Text>
      {rows.slice(start, start + listRows).map((r, k) => {
        const here = start + k === state.flagCursor;
        const text =
          r.region === null
            ? `${fit(r.flag, 12)}${fit(`${r.cells} cells`, 11)}${r.meaning}`
            : `  region ${fit(String(r.region), 5)}level ${fit(String(r.level), 4)}${fit(`${r.cells} cells`, 11)}${r.where}`;
        return (
          <Text key={`${r.flag}:${r.region ?? "all"}`} inverse={here} bold={r.region === null} color={r.region === null ? THEME.warn : undefined} wrap="truncate-end">
            {fit(`${here ? "›" : " "}${text}`, width)}
          </Text>
        );
      })}
      {current ? <Text color={THEME.dim} wrap="truncate-end">{`Enter shows ${current.region === null ? `every ${current.flag} cell` : `region ${current.region}`} on the map`}</Text> : null}
    </Box>
  );
}
