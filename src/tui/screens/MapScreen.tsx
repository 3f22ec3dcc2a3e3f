/**
 * Map screen: the heat map of the chosen per-cell quantity with its legend, and the full record of
 * the cell under the cursor.
 */
import { Box, Text } from "ink";
import { cellRecord } from "../state/cellRecord.js";
import { cellUnderCursor, chooseLayout, latticeLookup, renderHeatMap } from "../state/heatMap.js";
import { findQuantity, mapQuantities } from "../state/mapQuantities.js";
import type { SessionState } from "../state/sessionState.js";
import type { Plan } from "../../plan/planTypes.js";
import { Legend } from "../components/HeatMap.js";
import { HeatMapRows } from "../components/HeatMap.js";
import { THEME, fit } from "../theme.js";

const lookups = new WeakMap<Plan, Int32Array>();
function lookupFor(plan: Plan): Int32Array {
  let l = lookups.get(plan);
  if (!l) {
    l = latticeLookup(plan.grid);
    lookups.set(plan, l);
  }
  return l;
}

/** Width of the cell-record panel for a screen width. */
export function recordWidth(width: number): number {
  return width >= 120 ? 46 : width >= 100 ? 40 : 34;
}

export function MapScreen({ state, width, height }: { state: SessionState; width: number; height: number }) {
  const plan = state.plan;
  if (!plan) return <Text color={THEME.dim}>waiting for the first plan…</Text>;
  const q = findQuantity(plan, state.mapQuantity);
  const all = mapQuantities(plan);
  const at = all.findIndex((x) => x.id === q.id);
  const g = plan.grid;
  const layout = chooseLayout(g.nx, g.ny, state.mapArea.width, state.mapArea.height);
  const view = renderHeatMap(g, q.values, q.scale, q.summary, layout, state.cursor, q.missingLabel);
  const cell = cellUnderCursor(g, lookupFor(plan), layout, state.cursor);
  const rw = recordWidth(width);
  const mapWidth = Math.max(10, width - rw - 2);
  const record = cellRecord(plan, cell);
  const scaleNote =
    layout.blockX > 1 || layout.blockY > 1
      ? `${g.nx}×${g.ny} cells, ${layout.blockX}×${layout.blockY} per mark (${q.summary})`
      : `${g.nx}×${g.ny} cells`;
  return (
    <Box flexDirection="row" height={height}>
      <Box flexDirection="column" width={mapWidth}>
        <Text wrap="truncate-end">
          <Text bold>{`[${at + 1}/${all.length}] ${q.label}`}</Text>
        </Text>
        <Text color={THEME.dim} wrap="truncate-end">{`${scaleNote}; y up, cursor inverted`}</Text>
        <HeatMapRows view={view} />
        <Legend entries={view.legend} width={mapWidth} />
      </Box>
      <Box flexDirection="column" width={rw} marginLeft={2}>
        <Text bold color={THEME.accent}>Cell under the cursor</Text>
        {record.map((line, k) => (
          <Text key={k} wrap="wrap" color={line.warn ? THEME.warn : undefined}>
            <Text color={THEME.dim}>{fit(line.label, 10)}</Text>
            {line.value}
          </Text>
        ))}
      </Box>
    </Box>
  );
}
