/**
 * Map screen: the heat map of the chosen per-cell quantity with its legend, and the full record of
 * the cell under the cursor.
 */
import { Box, Text } from "ink";
import { cellRecord } from "../state/cellRecord.js";
import { cellUnderCursor, chooseLayout, latticeLookup, legendOf, renderHeatMap, type LegendEntry } from "../state/heatMap.js";
import { findQuantity, mapQuantities, type MapQuantity } from "../state/mapQuantities.js";
import type { SessionState } from "../state/sessionState.js";
import type { Plan } from "../../plan/planTypes.js";
import { HeatMapRows, Legend, packLegend } from "../components/HeatMap.js";
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

/** The legend of a quantity: full value ranges when they fit in two lines, else lower edges only. */
export function legendFor(q: MapQuantity, hasMissing: boolean, width: number): LegendEntry[] {
  const full = legendOf(q.scale, hasMissing, { missingLabel: q.missingLabel, format: q.format });
  if (packLegend(full, width).length <= 2) return full;
  return legendOf(q.scale, hasMissing, { missingLabel: q.missingLabel, format: q.format, compact: true });
}

/**
 * Width of the cell-record panel: a share of the screen, narrowed (down to 34) when that lets the
 * map keep two characters per cell.
 */
export function recordWidth(width: number, nx = 0): number {
  const preferred = width >= 120 ? 46 : width >= 100 ? 40 : 34;
  const needed = width - 2 - 2 * nx;
  if (nx > 0 && needed < preferred && needed >= 34) return needed;
  return preferred;
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
  const legend = legendFor(q, view.hasMissing, Math.max(10, width - recordWidth(width, g.nx) - 2));
  const cell = cellUnderCursor(g, lookupFor(plan), layout, state.cursor);
  const rw = recordWidth(width, g.nx);
  const mapWidth = Math.max(10, width - rw - 2);
  const record = cellRecord(plan, cell);
  const scaleNote =
    layout.blockX > 1 || layout.blockY > 1
      ? `${g.nx}×${g.ny} lattice, ${layout.blockX}×${layout.blockY} cells per mark (${q.summary}); y up`
      : `${g.nx}×${g.ny} lattice, one mark per cell; y up`;
  return (
    <Box flexDirection="row" height={height}>
      <Box flexDirection="column" width={mapWidth}>
        <Text wrap="truncate-end">
          <Text bold>{`${at + 1}/${all.length} ${q.label}`}</Text>
        </Text>
        <Text color={THEME.dim} wrap="truncate-end">{scaleNote}</Text>
        <HeatMapRows view={view} />
        <Legend entries={legend} width={mapWidth} />
      </Box>
      <Box flexDirection="column" width={rw} marginLeft={2}>
        <Text bold color={THEME.accent}>Cell under the cursor</Text>
        {record.map((line, k) => (
          <Text key={k} wrap="wrap" color={line.warn ? THEME.warn : undefined}>
            <Text color={THEME.dim}>{fit(line.label, 11)}</Text>
            {line.value}
          </Text>
        ))}
      </Box>
    </Box>
  );
}
