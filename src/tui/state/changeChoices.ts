/** Applying a change of the designer's choices to the session state. */
import type { PlanOverrides } from "../../plan/planTypes.js";
import type { SessionState } from "./sessionState.js";

function sameValue(a: unknown, b: unknown): boolean {
  if (Array.isArray(a) && Array.isArray(b)) return a.length === b.length && [...a].sort().join("\u0000") === [...b].sort().join("\u0000");
  return a === b;
}

/**
 * New choices: `patch` applied to the overrides; a value equal to the design's own is dropped from
 * the overrides (so the session file lists only real changes). Pushes the old choices for undo and
 * asks the shell for a new plan.
 */
export function changeChoices(state: SessionState, patch: PlanOverrides, status: string): SessionState {
  const next: Record<string, unknown> = { ...state.overrides };
  for (const [k, v] of Object.entries(patch)) {
    const baseValue = state.base ? (state.base as unknown as Record<string, unknown>)[k] : undefined;
    if (state.base && sameValue(v, baseValue)) delete next[k];
    else next[k] = v;
  }
  const overrides = next as PlanOverrides;
  if (JSON.stringify(overrides) === JSON.stringify(state.overrides)) return { ...state, status: `${status} (no change)` };
  const planWanted = state.planWanted + 1;
  return {
    ...state,
    overrides,
    history: [...state.history, state.overrides].slice(-50),
    planWanted,
    computing: { stage: "reduce", fraction: 0 },
    exportWanted: state.exportWanted === null ? null : planWanted,
    status,
  };
}

