/** Top two lines: what is being planned with which choices, the screen tabs and the progress. */
import { Box, Text } from "ink";
import { SCREENS } from "../state/keyBindings.js";
import { effectiveSettings, hasUnsavedChanges, planIsStale, type SessionState } from "../state/sessionState.js";
import { formatPercent } from "../state/formatValue.js";
import { STAGE_WORDS, THEME } from "../theme.js";

/**
 * The settings line, in the longest wording that fits `width` columns: words go before values
 * ("levels 5" → "5 lv", "process stereolithography" → "stereolithography"), so that at 80 columns
 * every setting stays visible; the last form is cut at the end by the caller if still too long.
 */
export function settingsLine(state: SessionState, width = Infinity): string {
  const s = effectiveSettings(state);
  if (!s) return "reading the design…";
  // the level count is a largest number: say so when the plan needs fewer (+ then changes nothing)
  const used = state.plan && !planIsStale(state) ? state.plan.levels.length : null;
  const levels = s.levels === null ? (used !== null ? `${used} (auto)` : "auto") : used !== null && used < s.levels ? `≤${s.levels} (${used} used)` : String(s.levels);
  const nMat = s.materials ? s.materials.length : null;
  const nFam = s.families ? s.families.length : null;
  const long = [s.polarization, s.scheme, `levels ${levels}`, `tol ${formatPercent(s.tolerance)}`, `process ${s.process ?? "none"}`];
  if (nMat !== null) long.push(`${nMat} materials`);
  if (nFam !== null) long.push(`${nFam} famil${nFam === 1 ? "y" : "ies"}`);
  const short = [s.polarization, s.scheme, `${levels} lv`, `tol ${formatPercent(s.tolerance)}`, s.process ?? "no process"];
  if (nMat !== null) short.push(`${nMat} mat`);
  if (nFam !== null) short.push(`${nFam} fam`);
  for (const [parts, sep] of [[long, " · "], [short, " · "], [short, " "]] as const) {
    const line = parts.join(sep);
    if (line.length <= width) return line;
  }
  return short.join(" ");
}

export function ProgressLine({ state, width }: { state: SessionState; width: number }) {
  const c = state.computing;
  if (!c) {
    if (state.planError) return <Text color={THEME.error}>plan failed</Text>;
    return <Text color={THEME.ok}>plan up to date</Text>;
  }
  const barWidth = width >= 100 ? 12 : 6;
  const filled = Math.round(Math.max(0, Math.min(1, c.fraction)) * barWidth);
  return (
    <Text color={THEME.warn} wrap="truncate-start">
      {STAGE_WORDS[c.stage] ?? c.stage} {"█".repeat(filled)}
      {"░".repeat(barWidth - filled)} {Math.round(c.fraction * 100)} %
    </Text>
  );
}

export function Header({ state, width }: { state: SessionState; width: number }) {
  const name = state.plan?.design.name ?? state.designPath.split(/[\\/]/).pop() ?? "";
  const unsaved = hasUnsavedChanges(state);
  return (
    <Box flexDirection="column" width={width}>
      <Box>
        <Box flexGrow={1} flexShrink={1}>
          <Text wrap="truncate-end">
            <Text bold color={THEME.accent}>cellwright</Text> <Text bold>{name}</Text>
          </Text>
        </Box>
        {unsaved ? (
          <Box flexShrink={0} marginLeft={1}>
            <Text color={THEME.warn} wrap="truncate">● unsaved</Text>
          </Box>
        ) : null}
      </Box>
      <Text wrap="truncate-end" color={THEME.pick}>{settingsLine(state, width)}</Text>
      <Box>
        <Box flexGrow={1} flexShrink={0}>
          {SCREENS.map((sc) => {
            const here = state.screen === sc.id;
            // the selected tab is bracketed as well as inverted, so it shows without colour
            return (
              <Text key={sc.id} inverse={here} bold={here}>
                {here ? `[${sc.key} ${sc.title}]` : ` ${sc.key} ${sc.title} `}
              </Text>
            );
          })}
        </Box>
        <ProgressLine state={state} width={width} />
      </Box>
    </Box>
  );
}
