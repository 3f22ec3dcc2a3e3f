/**
 * Reduction screen: the side-by-side costs of every scheme for the chosen polarization. The
 * scheme in force is marked ●; the row marker › moves with ↑/↓ and Enter makes it the choice.
 */
import { Box, Text } from "ink";
import { effectiveSettings, type SessionState } from "../state/sessionState.js";
import { THEME, fit } from "../theme.js";

export function ReductionScreen({ state, width, height }: { state: SessionState; width: number; height: number }) {
  const table = state.schemes;
  const settings = effectiveSettings(state);
  if (state.schemesError) return <Text color={THEME.error}>{`scheme comparison failed: ${state.schemesError}`}</Text>;
  if (!table || !settings) return <Text color={THEME.dim}>comparing the schemes…</Text>;
  const stale = table.polarization !== settings.polarization;
  const nameW = 14;
  const colW = Math.min(
    Math.max(8, Math.floor((width - nameW - 2) / table.columns.length)),
    Math.max(...table.columns.map((c) => c.length), ...table.rows.flatMap((r) => r.cells.map((c) => c.length))) + 2,
  );
  const current = table.rows[state.schemeCursor];
  const notesRoom = Math.max(0, height - table.rows.length - 6);
  return (
    <Box flexDirection="column" height={height}>
      <Text bold>
        {`Reduction schemes for ${table.polarization}`}
        <Text color={THEME.dim}>{stale ? "  (updating…)" : `  — ${table.polarization === "Ez" ? "E along z: ε_z and in-plane μ act" : "H along z: μ_z and in-plane ε act"}`}</Text>
      </Text>
      <Text color={THEME.dim}>{`  ${fit("scheme", nameW)}${table.columns.map((c) => fit(c, colW)).join("")}`}</Text>
      {table.rows.map((row, k) => {
        const picked = row.scheme === settings.scheme;
        const here = k === state.schemeCursor;
        return (
          <Text key={row.scheme} inverse={here} color={picked ? THEME.pick : undefined} bold={picked}>
            {`${here ? "›" : " "}${picked ? "●" : " "}${fit(row.scheme, nameW - 1)} ${row.cells.map((c) => fit(c, colW)).join("")}`}
          </Text>
        );
      })}
      <Box marginTop={1} flexDirection="column">
        {current ? (
          <Text wrap="wrap">
            <Text bold>{current.scheme}</Text>: {current.summary}
          </Text>
        ) : null}
        {table.notes.slice(0, notesRoom).map((n, k) => (
          <Text key={k} color={THEME.dim} wrap="wrap">{n}</Text>
        ))}
      </Box>
    </Box>
  );
}
