/**
 * Levels screen: one row per level (cells, target, error of its recipe, number of runners-up,
 * recipe), the selected one marked › (and inverted), and below, everything about the selected
 * level including its runners-up.
 */
import { Box, Text } from "ink";
import { levelDetail, levelRows } from "../state/levelViews.js";
import { prettyComponent } from "../state/mapQuantities.js";
import { scrollStart } from "../state/scrollWindow.js";
import { formatPercent } from "../state/formatValue.js";
import type { SessionState } from "../state/sessionState.js";
import { THEME, fit } from "../theme.js";

/** Rows the list part takes at a given body height (the detail gets the rest). */
export function levelListRows(height: number): number {
  return Math.max(3, Math.floor((height - 4) / 2));
}

export function LevelsScreen({ state, width, height }: { state: SessionState; width: number; height: number }) {
  const plan = state.plan;
  if (!plan) return <Text color={THEME.dim}>waiting for the first plan…</Text>;
  const rows = levelRows(plan);
  const listRows = levelListRows(height);
  const start = scrollStart(state.levelCursor, rows.length, listRows);
  const targetW = Math.max(12, Math.min(24, 7 * plan.components.length + 2));
  const recipeW = Math.max(10, width - 1 - 4 - 6 - targetW - 10 - 4 - 1);
  const detail = levelDetail(plan, state.levelCursor);
  // summary, column titles, list, pager line, blank line, detail: exactly `height` rows
  const detailRows = Math.max(1, height - listRows - 4);
  const f = plan.figures;
  return (
    <Box flexDirection="column" height={height} flexShrink={0}>
      <Text wrap="truncate-end">
        <Text bold>{`${plan.levels.length} levels, ${plan.regions.length} regions, ${plan.grid.count} cells`}</Text>
        <Text color={THEME.dim}>{`  largest error ${formatPercent(f.maxRelError)}, median ${formatPercent(f.medianRelError)}${plan.buildable ? "" : " (cells with a recipe)"}`}</Text>
        {plan.buildable ? <Text color={THEME.ok}>  buildable</Text> : <Text color={THEME.warn}>  some levels have no recipe</Text>}
      </Text>
      <Text color={THEME.dim}>
        {` ${fit("lvl", 4)}${fit("cells", 6)}${fit(`target ${plan.components.map((c) => prettyComponent(c.name)).join(" ")}`, targetW)}${fit("error", 10)}${fit("alt", 4)}recipe`}
      </Text>
      {rows.slice(start, start + listRows).map((r, k) => {
        const here = start + k === state.levelCursor;
        return (
          <Text key={r.index} inverse={here} color={r.buildable ? undefined : THEME.warn}>
            {`${here ? "›" : " "}${fit(String(r.index), 4)}${fit(String(r.cells), 6)}${fit(r.target, targetW)}${fit(r.error, 10)}${fit(String(r.runnersUp), 4)}${fit(r.recipe, recipeW)}`}
          </Text>
        );
      })}
      <Text color={THEME.dim}>{rows.length > listRows ? `rows ${start + 1}–${Math.min(rows.length, start + listRows)} of ${rows.length} (PgUp/PgDn)` : " "}</Text>
      <Box flexDirection="column" marginTop={1} flexShrink={0}>
        {detail.slice(0, detailRows).map((line, k) => (
          <Text key={k} wrap="truncate-end" bold={k === 0}>{line}</Text>
        ))}
      </Box>
    </Box>
  );
}
