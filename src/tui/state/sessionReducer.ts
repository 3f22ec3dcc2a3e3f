/**
 * The session's reducer: (state, typed action) → new state, with no side effects. Key presses
 * arrive as `command` actions (see keyBindings.ts); results of the shell's work (plan, scheme table,
 * writes) arrive as their own actions. The shell watches `planWanted`, `exportWanted`, `saveWanted`
 * and `exitNow` and does the work they ask for.
 */
import type { Plan, PlanOverrides, PlanSettings, PlanStage, Polarization } from "../../plan/planTypes.js";
import { schemesFor } from "../../reduce/schemes/registry.js";
import { chooseLayout, moveCursor } from "./heatMap.js";
import { commandForKey, helpSections, SCREENS, type CommandId, type KeyScope } from "./keyBindings.js";
import { mapQuantities, findQuantity, largestValueCell } from "./mapQuantities.js";
import { levelCentreCell } from "./levelViews.js";
import { flagRegionRows } from "./flagRegions.js";
import { formatLength, formatPercent } from "./formatValue.js";
import { effectiveSettings, hasUnsavedChanges, type PickOption, type SchemeTableView, type SessionState } from "./sessionState.js";
import { pickerCommand } from "./pickerReducer.js";
import { changeChoices } from "./changeChoices.js";

export type SessionAction =
  | { type: "command"; command: CommandId }
  /** a key press by name (see `keyName`), resolved against the state it arrives at, not the one on screen */
  | { type: "key"; name: string }
  | { type: "designLoaded"; base: PlanSettings; options?: SessionState["options"] }
  | { type: "loadFailed"; message: string }
  | { type: "planProgress"; seq: number; stage: PlanStage; fraction: number }
  | { type: "planReady"; seq: number; plan: Plan }
  | { type: "planFailed"; seq: number; message: string }
  | { type: "schemesReady"; table: SchemeTableView }
  | { type: "schemesFailed"; polarization: Polarization; message: string }
  | { type: "exportDone"; paths: string[]; overrides: PlanOverrides }
  | { type: "exportFailed"; message: string }
  | { type: "saveDone"; path: string; overrides: PlanOverrides }
  | { type: "saveFailed"; message: string }
  | { type: "resize"; mapArea: { width: number; height: number }; listRows: number };

/** Tolerance steps of `[` and `]` (relative error). */
export const TOLERANCE_STEPS = [0.001, 0.002, 0.005, 0.01, 0.02, 0.03, 0.05, 0.075, 0.1, 0.15, 0.2, 0.3] as const;
export const MAX_LEVEL_COUNT = 256;

function needSettings(state: SessionState): PlanSettings | null {
  return effectiveSettings(state);
}

/** The scheme that takes over when the polarization changes and the current one no longer applies. */
function schemeAfterSwitch(scheme: string, polarization: Polarization): string {
  const valid = schemesFor(polarization).map((s) => s.name as string);
  if (valid.includes(scheme)) return scheme;
  if (scheme === "unit-mu" && valid.includes("non-magnetic")) return "non-magnetic";
  if (scheme === "non-magnetic" && valid.includes("unit-mu")) return "unit-mu";
  return valid.includes("full") ? "full" : valid[0];
}

function clamp(v: number, lo: number, hi: number): number {
  return Math.max(lo, Math.min(hi, v));
}

function jumpTo(state: SessionState, plan: Plan, cell: number, quantity: string, status: string): SessionState {
  if (cell < 0) return { ...state, status: "nothing to show on the map" };
  return { ...state, screen: "map", mapQuantity: quantity, cursor: { i: plan.grid.i[cell], j: plan.grid.j[cell] }, status };
}

function listMove(state: SessionState, command: CommandId): SessionState {
  const plan = state.plan;
  if (!plan) return state;
  const step = command === "up" ? -1 : command === "down" ? 1 : command === "pageUp" ? -state.listRows : command === "pageDown" ? state.listRows : 0;
  if (state.screen === "levels") return { ...state, levelCursor: clamp(state.levelCursor + step, 0, Math.max(0, plan.levels.length - 1)) };
  if (state.screen === "flags") return { ...state, flagCursor: clamp(state.flagCursor + step, 0, Math.max(0, flagRegionRows(plan).length - 1)) };
  if (state.screen === "reduction") return { ...state, schemeCursor: clamp(state.schemeCursor + step, 0, Math.max(0, (state.schemes?.rows.length ?? 1) - 1)) };
  return state;
}

function mapCommand(state: SessionState, command: CommandId): SessionState {
  const plan = state.plan;
  if (!plan) return state;
  const g = plan.grid;
  if (command === "nextQuantity" || command === "prevQuantity") {
    const all = mapQuantities(plan);
    const at = all.findIndex((q) => q.id === state.mapQuantity);
    const n = all.length;
    const k = at < 0 ? (command === "nextQuantity" ? 0 : n - 1) : (at + (command === "nextQuantity" ? 1 : n - 1)) % n;
    return { ...state, mapQuantity: all[k].id };
  }
  if (command === "worstCell") {
    const q = findQuantity(plan, state.mapQuantity);
    const c = largestValueCell(q.values);
    if (c < 0) return { ...state, status: "no cell has a value of this quantity" };
    return { ...state, cursor: { i: g.i[c], j: g.j[c] }, status: `largest ${q.label.split(":")[0]}: ${q.format(q.values[c])} at x ${formatLength(g.xM[c])}, y ${formatLength(g.yM[c])}` };
  }
  const layout = chooseLayout(g.nx, g.ny, state.mapArea.width, state.mapArea.height);
  const d = { up: [0, -1], down: [0, 1], left: [-1, 0], right: [1, 0] }[command as "up" | "down" | "left" | "right"];
  if (!d) return state;
  return { ...state, cursor: moveCursor(g, layout, state.cursor, d[0], d[1]) };
}

function screenCommand(state: SessionState, command: CommandId): SessionState {
  const plan = state.plan;
  if (command === "choose") {
    if (state.screen === "reduction") {
      const row = state.schemes?.rows[state.schemeCursor];
      if (!row) return state;
      return changeChoices(state, { scheme: row.scheme as PlanSettings["scheme"] }, `scheme ${row.scheme}`);
    }
    if (!plan) return state;
    if (state.screen === "levels") {
      const level = plan.levels[state.levelCursor];
      if (!level) return state;
      return jumpTo(state, plan, levelCentreCell(plan, state.levelCursor), "level", `level ${level.index} on the map`);
    }
    if (state.screen === "flags") {
      const row = flagRegionRows(plan)[state.flagCursor];
      if (!row) return state;
      const what = row.region === null ? `all cells flagged ${row.flag}` : `region ${row.region} (flag ${row.flag})`;
      return jumpTo(state, plan, row.jumpCell, `flag:${row.flag}`, what);
    }
    return state;
  }
  if (state.screen === "map") return mapCommand(state, command);
  return listMove(state, command);
}

function openPicker(state: SessionState, field: "materials" | "families" | "process"): SessionState {
  const s = needSettings(state);
  if (!s) return { ...state, status: "wait until the design is read" };
  if (field === "process") {
    const at = state.options.processes.findIndex((p) => p.id === s.process);
    return { ...state, overlay: { kind: "picker", field, cursor: at + 1, chosen: s.process } };
  }
  const list: PickOption[] = state.options[field];
  if (list.length === 0) return { ...state, status: `no ${field} in the catalog` };
  return { ...state, overlay: { kind: "picker", field, cursor: 0, chosen: s[field] ? [...(s[field] as string[])] : null } };
}

function globalCommand(state: SessionState, command: CommandId): SessionState {
  const s = needSettings(state);
  switch (command) {
    case "nextScreen":
    case "prevScreen": {
      const k = SCREENS.findIndex((x) => x.id === state.screen);
      const n = SCREENS.length;
      return { ...state, screen: SCREENS[(k + (command === "nextScreen" ? 1 : n - 1)) % n].id };
    }
    case "screenReduction":
      return { ...state, screen: "reduction" };
    case "screenMap":
      return { ...state, screen: "map" };
    case "screenLevels":
      return { ...state, screen: "levels" };
    case "screenFlags":
      return { ...state, screen: "flags" };
    case "help":
      return { ...state, overlay: { kind: "help", offset: 0 } };
    case "quit":
      if (hasUnsavedChanges(state)) return { ...state, overlay: { kind: "confirmQuit" } };
      return { ...state, exitNow: true };
    case "forceQuit":
      return { ...state, exitNow: true };
    case "save":
      return { ...state, saveWanted: true, status: "saving the choices…" };
    case "export":
      return { ...state, exportWanted: state.planWanted, exportLayout: false, status: "exporting…" };
    case "exportLayout":
      return { ...state, exportWanted: state.planWanted, exportLayout: true, status: "exporting with the layout files…" };
    case "undo": {
      if (state.history.length === 0) return { ...state, status: "nothing to undo" };
      const overrides = state.history[state.history.length - 1];
      return { ...state, overrides, history: state.history.slice(0, -1), planWanted: state.planWanted + 1, computing: { stage: "reduce", fraction: 0 }, status: "undone" };
    }
    case "pickMaterials":
      return openPicker(state, "materials");
    case "pickFamilies":
      return openPicker(state, "families");
    case "pickProcess":
      return openPicker(state, "process");
    default:
      break;
  }
  if (!s) return { ...state, status: "wait until the design is read" };
  switch (command) {
    case "togglePolarization": {
      const polarization: Polarization = s.polarization === "Ez" ? "Hz" : "Ez";
      const scheme = schemeAfterSwitch(s.scheme, polarization) as PlanSettings["scheme"];
      const note = scheme !== s.scheme ? `; scheme ${s.scheme} does not serve ${polarization}, now ${scheme}` : "";
      return changeChoices(state, { polarization, scheme }, `polarization ${polarization}${note}`);
    }
    case "levelsUp":
    case "levelsDown": {
      const current = s.levels ?? state.plan?.levels.length ?? null;
      if (current === null) return { ...state, status: "wait for the first plan" };
      const levels = clamp(current + (command === "levelsUp" ? 1 : -1), 1, MAX_LEVEL_COUNT);
      return changeChoices(state, { levels }, `levels ${levels}`);
    }
    case "levelsAuto":
      return changeChoices(state, { levels: null }, "levels: as few as the tolerance allows");
    case "applyRemedy": {
      // the best remedy the session can apply (a new pitch is a change of the design's grid, another
      // background material a change of its reduction keys: the remedy's label names them)
      const r = state.plan?.remedies?.remedies.find((x) => x.pitchM === null && !x.design);
      if (!r) return { ...state, status: state.plan?.verdict.buildable ? "the plan is buildable as asked: nothing to remedy" : "no remedy the session can apply (none tried helps, or only a change of the design does: a new grid.pitch or background material, as the remedy says)" };
      return changeChoices(state, r.overrides, `applied: ${r.label}`);
    }
    case "toleranceTighter":
    case "toleranceLooser": {
      const t = s.tolerance;
      const next =
        command === "toleranceTighter"
          ? [...TOLERANCE_STEPS].reverse().find((x) => x < t - 1e-12)
          : TOLERANCE_STEPS.find((x) => x > t + 1e-12);
      if (next === undefined) return { ...state, status: `tolerance ${formatPercent(t)} is the ${command === "toleranceTighter" ? "tightest" : "loosest"} step` };
      return changeChoices(state, { tolerance: next }, `tolerance ${formatPercent(next)}`);
    }
    default:
      return state;
  }
}

function commandReducer(state: SessionState, command: CommandId): SessionState {
  const cleared: SessionState = { ...state, status: null };
  const o = state.overlay;
  if (o) {
    if (command === "forceQuit") return { ...cleared, exitNow: true };
    if (command === "quit") return globalCommand({ ...cleared, overlay: null }, "quit");
    if (o.kind === "picker") return pickerCommand(cleared, o, command);
    if (o.kind === "help" && (command === "up" || command === "down" || command === "pageUp" || command === "pageDown")) {
      const step = command === "up" ? -1 : command === "down" ? 1 : command === "pageUp" ? -state.listRows : state.listRows;
      const total = helpSections().reduce((n, sec) => n + sec.rows.length + 2, 0);
      return { ...cleared, overlay: { kind: "help", offset: clamp(o.offset + step, 0, Math.max(0, total - state.listRows)) } };
    }
    if (o.kind === "confirmQuit") {
      if (command === "confirmYes") return { ...cleared, overlay: null, exitNow: true };
      if (command === "confirmSave") return { ...cleared, overlay: null, saveWanted: true, quitWanted: true, status: "saving the choices…" };
    }
    if (command === "close") return { ...cleared, overlay: null };
    return state;
  }
  const screenScoped: CommandId[] = ["up", "down", "left", "right", "pageUp", "pageDown", "choose", "nextQuantity", "prevQuantity", "worstCell"];
  if (screenScoped.includes(command)) return screenCommand(cleared, command);
  return globalCommand(cleared, command);
}

/** A resumed cursor if it is on the lattice, else the device cell nearest the lattice's centre. */
function startCursor(plan: Plan, cursor: { i: number; j: number }, resumed: boolean): { i: number; j: number } {
  const g = plan.grid;
  if (resumed && cursor.i >= 0 && cursor.j >= 0 && cursor.i < g.nx && cursor.j < g.ny) return cursor;
  const ci = (g.nx - 1) / 2;
  const cj = (g.ny - 1) / 2;
  let best = 0;
  let bestD = Infinity;
  for (let c = 0; c < g.count; c++) {
    const d = (g.i[c] - ci) ** 2 + (g.j[c] - cj) ** 2;
    if (d < bestD) {
      bestD = d;
      best = c;
    }
  }
  return g.count > 0 ? { i: g.i[best], j: g.j[best] } : { i: 0, j: 0 };
}

/** The key scope of the open overlay, or null when none is open. */
export function overlayScope(state: SessionState): KeyScope | null {
  const o = state.overlay;
  if (!o) return null;
  return o.kind === "picker" ? "picker" : o.kind;
}

/** The session's reducer. */
export function sessionReducer(state: SessionState, action: SessionAction): SessionState {
  switch (action.type) {
    case "command":
      return commandReducer(state, action.command);
    case "key": {
      const command = commandForKey(action.name, overlayScope(state), state.screen);
      return command ? commandReducer(state, command) : state;
    }
    case "designLoaded":
      return { ...state, base: action.base, options: action.options ?? state.options, computing: { stage: "reduce", fraction: 0 } };
    case "loadFailed":
      return { ...state, computing: null, planError: action.message };
    case "planProgress":
      if (action.seq !== state.planWanted) return state;
      return { ...state, computing: { stage: action.stage, fraction: action.fraction } };
    case "planReady": {
      if (action.seq <= state.planSeq) return state;
      const plan = action.plan;
      const first = state.plan === null;
      return {
        ...state,
        plan,
        planSeq: action.seq,
        planError: null,
        computing: action.seq === state.planWanted ? null : state.computing,
        cursor: first ? startCursor(plan, state.cursor, state.cursorResumed) : state.cursor,
        levelCursor: clamp(state.levelCursor, 0, Math.max(0, plan.levels.length - 1)),
        flagCursor: clamp(state.flagCursor, 0, Math.max(0, flagRegionRows(plan).length - 1)),
      };
    }
    case "planFailed":
      if (action.seq < state.planWanted) return state;
      return { ...state, planSeq: action.seq, planError: action.message, computing: null, exportWanted: null };
    case "schemesReady": {
      const current = effectiveSettings(state)?.scheme;
      const at = action.table.rows.findIndex((r) => r.scheme === current);
      return { ...state, schemes: action.table, schemesError: null, schemeCursor: at >= 0 ? at : 0 };
    }
    case "schemesFailed":
      return { ...state, schemes: null, schemesError: action.message };
    case "exportDone":
      return {
        ...state,
        exportWanted: null,
        savedOverrides: action.overrides,
        overlay: { kind: "notice", title: "Exported", lines: action.paths, tone: "ok" },
        status: null,
      };
    case "exportFailed":
      return { ...state, exportWanted: null, overlay: { kind: "notice", title: "Export failed", lines: [action.message], tone: "error" }, status: null };
    case "saveDone":
      return { ...state, saveWanted: false, savedOverrides: action.overrides, status: `choices saved to ${action.path}`, exitNow: state.quitWanted };
    case "saveFailed":
      return { ...state, saveWanted: false, quitWanted: false, overlay: { kind: "notice", title: "Saving failed", lines: [action.message], tone: "error" }, status: null };
    case "resize":
      return { ...state, mapArea: action.mapArea, listRows: Math.max(1, action.listRows) };
    default: {
      // exhaustive: a new action type that is not handled above fails to compile here
      const unhandled: never = action;
      return unhandled;
    }
  }
}
