/** The overlays that take over the body: help, picker, quit question, notices. */
import { Box, Text } from "ink";
import { helpSections } from "../state/keyBindings.js";
import { pickerAllows, pickerItems } from "../state/pickerReducer.js";
import { scrollStart } from "../state/scrollWindow.js";
import { canonicalOverrides, type Overlay, type SessionState } from "../state/sessionState.js";
import { THEME, fit } from "../theme.js";

/** Every line of the help, section titles included (one key table feeds it). */
export function helpLines(): { text: string; title: boolean }[] {
  const out: { text: string; title: boolean }[] = [];
  for (const sec of helpSections()) {
    out.push({ text: sec.title, title: true });
    for (const r of sec.rows) out.push({ text: `  ${fit(r.label, 12)}${r.does}`, title: false });
    out.push({ text: "", title: false });
  }
  return out;
}

export function HelpOverlay({ offset, width, height }: { offset: number; width: number; height: number }) {
  const lines = helpLines();
  // two columns when the screen is wide enough, else one scrolling column
  const columns = width >= 110 ? 2 : 1;
  const perColumn = Math.ceil(lines.length / columns);
  const rows = Math.max(1, height - 1);
  const start = Math.min(offset, Math.max(0, perColumn - rows));
  const colWidth = Math.floor(width / columns) - 1;
  return (
    <Box flexDirection="column" height={height}>
      <Text bold color={THEME.accent} wrap="truncate-end">
        {`Keys${perColumn > rows ? `  (↑/↓ scroll, lines ${start + 1}–${Math.min(perColumn, start + rows)} of ${perColumn})` : ""}  Esc closes`}
      </Text>
      <Box flexDirection="row">
        {Array.from({ length: columns }, (_, c) => (
          <Box key={c} flexDirection="column" width={colWidth} marginRight={1}>
            {lines.slice(c * perColumn + start, c * perColumn + Math.min(perColumn, start + rows)).map((l, k) => (
              <Text key={k} bold={l.title} color={l.title ? THEME.accent : undefined} wrap="truncate-end">
                {l.text || " "}
              </Text>
            ))}
          </Box>
        ))}
      </Box>
    </Box>
  );
}

const PICKER_TITLES = {
  materials: "Allowed materials (host and inclusion)",
  families: "Allowed unit-cell families",
  process: "Fabrication process",
} as const;

export function PickerOverlay({ state, picker, width, height }: { state: SessionState; picker: Extract<Overlay, { kind: "picker" }>; width: number; height: number }) {
  const items = pickerItems(state, picker.field);
  const rows = Math.max(1, height - 3);
  const start = scrollStart(picker.cursor, items.length, rows);
  const single = picker.field === "process";
  // id and name in columns of their own, each cut with an ellipsis when too long:
  // "›[x] <id>  <name>"; the id column takes the longest id, at most 40 % of the line
  const idWidth = Math.max(4, Math.min(Math.max(...items.map((x) => [...x.id].length)), Math.floor((width - 6) * 0.4)));
  const labelWidth = Math.max(4, width - 6 - idWidth);
  const summary = single
    ? "↑/↓ move · Enter use it · a design's choice · Esc cancel"
    : `${picker.chosen === null ? "all allowed (design default)" : `${picker.chosen.length} of ${items.length} allowed`} · Space allow/forbid · a design's choice · Enter apply · Esc cancel`;
  return (
    <Box flexDirection="column" height={height}>
      <Text bold color={THEME.accent}>{PICKER_TITLES[picker.field]}</Text>
      <Text color={THEME.dim} wrap="truncate-end">{summary}</Text>
      {items.slice(start, start + rows).map((item, k) => {
        const here = start + k === picker.cursor;
        const on = pickerAllows(picker, item.id);
        const mark = single ? (on ? "(•)" : "( )") : on ? "[x]" : "[ ]";
        return (
          <Text key={item.id || "none"} inverse={here} color={on ? undefined : THEME.dim} wrap="truncate-end">
            {`${here ? "›" : " "}${mark} ${fit(item.id, idWidth)} ${fit(item.label, labelWidth)}`}
          </Text>
        );
      })}
      {items.length > rows ? <Text color={THEME.dim}>{`${start + 1}–${Math.min(items.length, start + rows)} of ${items.length}`}</Text> : null}
    </Box>
  );
}

/** "levels 4, tolerance 0.03" — what changed since the last save. */
export function changesText(state: SessionState): string {
  const now = canonicalOverrides(state.overrides) as Record<string, unknown>;
  const saved = canonicalOverrides(state.savedOverrides) as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(now), ...Object.keys(saved)])].sort();
  const parts: string[] = [];
  for (const k of keys) {
    if (JSON.stringify(now[k]) === JSON.stringify(saved[k])) continue;
    const v = now[k];
    parts.push(`${k} ${v === undefined ? "(design's own)" : Array.isArray(v) ? `${v.length} chosen` : String(v ?? "none")}`);
  }
  return parts.join(", ");
}

export function ConfirmQuit({ state }: { state: SessionState }) {
  return (
    <Box flexDirection="column" borderStyle="round" borderColor={THEME.warn} paddingX={1}>
      <Text bold color={THEME.warn}>Quit with unsaved choices?</Text>
      <Text wrap="wrap">{`changed: ${changesText(state)}`}</Text>
      <Text wrap="wrap">{`s saves them to ${state.sessionPath} and quits · y quits without saving · n or Esc stays`}</Text>
    </Box>
  );
}

export function Notice({ title, lines, tone }: { title: string; lines: string[]; tone: "ok" | "error" }) {
  return (
    <Box flexDirection="column" borderStyle="round" borderColor={tone === "ok" ? THEME.ok : THEME.error} paddingX={1}>
      <Text bold color={tone === "ok" ? THEME.ok : THEME.error}>{title}</Text>
      {lines.map((l, k) => (
        <Text key={k} wrap="wrap">{l}</Text>
      ))}
      <Text color={THEME.dim}>Enter or Esc closes</Text>
    </Box>
  );
}
