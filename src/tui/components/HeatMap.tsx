/** Draws a `HeatMapView` (state/heatMap.ts): glyph runs in colour, the cursor inverted, and the legend. */
import { Box, Text } from "ink";
import type { HeatMapView, LegendEntry } from "../state/heatMap.js";

export function HeatMapRows({ view }: { view: HeatMapView }) {
  return (
    <Box flexDirection="column">
      {view.rows.map((runs, r) => (
        <Text key={r}>
          {runs.map((run, k) => (
            <Text key={k} color={run.colour ?? undefined} inverse={run.inverse}>
              {run.text}
            </Text>
          ))}
        </Text>
      ))}
    </Box>
  );
}

/** Legend entries "glyph label", packed into lines of `width` characters. */
export function packLegend(entries: LegendEntry[], width: number): LegendEntry[][] {
  const lines: LegendEntry[][] = [[]];
  let used = 0;
  for (const e of entries) {
    const w = [...e.label].length + 4; // "g label  "
    if (used > 0 && used + w > width) {
      lines.push([]);
      used = 0;
    }
    lines[lines.length - 1].push(e);
    used += w;
  }
  return lines;
}

export function Legend({ entries, width }: { entries: LegendEntry[]; width: number }) {
  return (
    <Box flexDirection="column">
      {packLegend(entries, width).map((line, r) => (
        <Text key={r} wrap="truncate-end">
          {line.map((e, k) => (
            <Text key={k}>
              <Text color={e.colour ?? undefined} bold>{e.glyph}</Text> {e.label}{"  "}
            </Text>
          ))}
        </Text>
      ))}
    </Box>
  );
}
