/**
 * Levels screen: one row per level (cells, target, error of its recipe, number of runners-up,
 * recipe), the selected one marked › (and inverted), and below, everything about the selected
 * level including its runners-up.
 */
import { Box, Text } from "ink";
import { levelDetail, levelRows, verdictLines } from "../state/levelViews.js";
import { prettyComponent } from "../state/mapQuantities.js";
import { scrollStart } from "../state/scrollWindow.js";
import { formatPercent } from "../state/formatValue.js";
import type { SessionState } from "../state/sessionState.js";
import { THEME, fit } from "../theme.js";

/** Rows the list part takes at a given body height (the detail gets the rest). */
export function levelListRows(height: number, buildable = true): number {
  // a plan that misses requirements needs room below for what would help and what was missed
  return Math.max(3, Math.floor((height - 4) / (buildable ? 2 : 3)));
}

export function LevelsScreen({ state, width, height }: { state: SessionState; width: number; height: number }) {
  const plan = state.plan;
  if (!plan) return <Text color={THEME.dim}>waiting for the first plan…</Text>;
  const rows = levelRows(plan);
  const listRows = levelListRows(height, plan.verdict.buildable);
  const start = scrollStart(state.levelCursor, rows.length, listRows);
  const targetW = Math.max(12, Math.min(24, 7 * plan.components.length + 2));
  // error columns are one wider than their titles so that the titles never run together
  const errW = 11;
  const recipeW = Math.max(10, width - 1 - 4 - 6 - targetW - 2 * errW - 4 - 1);
  const detail = [...verdictLines(plan), ...levelDetail(plan, state.levelCursor)];
  // summary, column titles, list, pager line, blank line, detail: exactly `height` rows; a list
  // shorter than its share gives the rest to the detail (verdict, remedies, the level)
  const shownRows = Math.min(listRows, rows.length);
  const detailRows = Math.max(1, height - shownRows - 4);
  const f = plan.figures;
  return (
    <Box flexDirection="column" height={height} flexShrink={0}>
      <Text wrap="truncate-end">
        {plan.verdict.buildable ? <Text color={THEME.ok}>buildable as asked  </Text> : <Text color={THEME.warn}>{`NOT buildable: missed ${plan.verdict.missed.map((m) => m.what).join(", ")}  `}</Text>}
        <Text bold>{`${plan.levels.length} levels, ${plan.regions.length} regions, ${plan.grid.count} cells`}</Text>
        <Text color={THEME.dim}>{`  largest error ${formatPercent(f.maxRelError)}, median ${formatPercent(f.medianRelError)}${plan.buildable ? "" : " (cells with a recipe)"}`}</Text>
      </Text>
      <Text color={THEME.dim}>
        {` ${fit("lvl", 4)}${fit("cells", 6)}${fit(`target ${plan.components.map((c) => prettyComponent(c.name)).join(" ")}`, targetW)}${fit("recipe err", errW)}${fit("quant err", errW)}${fit("alt", 4)}recipe`}
      </Text>
      {rows.slice(start, start + listRows).map((r, k) => {
        const here = start + k === state.levelCursor;
        return (
          <Text key={r.index} inverse={here} color={r.buildable ? undefined : THEME.warn}>
            {`${here ? "›" : " "}${fit(String(r.index), 4)}${fit(String(r.cells), 6)}${fit(r.target, targetW)}${fit(r.error, errW)}${fit(r.quantization, errW)}${fit(String(r.runnersUp), 4)}${fit(r.recipe, recipeW)}`}
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
