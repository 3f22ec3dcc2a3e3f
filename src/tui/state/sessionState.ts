/**
 * The interactive session's state: what the designer chose (overrides on top of the design), where
 * they are looking, and what the shell has computed for them (plan, scheme table). Plain data, no
 * ink or react; `sessionReducer` turns typed actions into new states.
 */
import type { Plan, PlanOverrides, PlanSettings, PlanStage, Polarization } from "../../plan/planTypes.js";
import type { ScreenId } from "./keyBindings.js";

/** One row of the scheme comparison, as the Reduction screen shows it. */
export interface SchemeRowView {
  scheme: string;
  /** one-line explanation of the scheme */
  summary: string;
  /** cells and values as display strings, in `SchemeTableView.columns` order */
  cells: string[];
}

export interface SchemeTableView {
  polarization: Polarization;
  columns: string[];
  rows: SchemeRowView[];
  /** notes printed under the table (e.g. the smallest background index) */
  notes: string[];
}

/** An item of a picker (material, family, process). */
export interface PickOption {
  id: string;
  label: string;
}

export type Overlay =
  | { kind: "help"; offset: number }
  | { kind: "confirmQuit" }
  | {
      kind: "picker";
      field: "materials" | "families";
      cursor: number;
      /** working copy of the allowed ids (null = the design's own choice) */
      chosen: string[] | null;
    }
  | { kind: "picker"; field: "process"; cursor: number; chosen: string | null }
  | { kind: "notice"; title: string; lines: string[]; tone: "ok" | "error" };

export interface Computation {
  stage: PlanStage | "schemes" | "load";
  /** 0 … 1 within the stage */
  fraction: number;
}

export interface SessionState {
  designPath: string;
  /** where `e` writes, and the session file inside it */
  outDir: string;
  sessionPath: string;
  /** the design's own settings, resolved (null until the design has been read) */
  base: PlanSettings | null;
  overrides: PlanOverrides;
  /** overrides as last saved (or as opened): quitting asks when they differ */
  savedOverrides: PlanOverrides;
  /** earlier overrides, newest last, for undo */
  history: PlanOverrides[];
  options: { materials: PickOption[]; families: PickOption[]; processes: PickOption[] };

  screen: ScreenId;
  overlay: Overlay | null;
  /** one-line message under the screen (cleared by the next key) */
  status: string | null;

  schemeCursor: number;
  mapQuantity: string;
  cursor: { i: number; j: number };
  /** the cursor came from a saved session (kept on the first plan) */
  cursorResumed: boolean;
  /** characters available for the heat map (set by the shell from the terminal size) */
  mapArea: { width: number; height: number };
  levelCursor: number;
  flagCursor: number;
  /** rows that fit in the Levels and Flags lists (for paging) */
  listRows: number;

  /** plan requests: `planWanted` grows with every change of choices; `plan` answers `planSeq` */
  planWanted: number;
  planSeq: number;
  plan: Plan | null;
  planError: string | null;
  computing: Computation | null;
  schemes: SchemeTableView | null;
  schemesError: string | null;
  /** set by `e`: export once the plan for this request is ready */
  exportWanted: number | null;
  /** the wanted export also writes the layout files (key l on the Levels screen) */
  exportLayout?: boolean;
  /** set by `s` (or quit-and-save): write the session file */
  saveWanted: boolean;
  /** quit once pending writes are done */
  quitWanted: boolean;
  /** the shell should exit now */
  exitNow: boolean;
}

export interface InitialSession {
  designPath: string;
  outDir: string;
  sessionPath: string;
  overrides?: PlanOverrides;
  options?: SessionState["options"];
  view?: { screen?: string; mapQuantity?: string; cursorI?: number; cursorJ?: number };
  mapArea?: { width: number; height: number };
}

const SCREEN_IDS: readonly ScreenId[] = ["reduction", "map", "levels", "flags"];

/** A new session, before anything was computed. A resumed session restores its view. */
export function initialSessionState(init: InitialSession): SessionState {
  const overrides = { ...(init.overrides ?? {}) };
  const screen = SCREEN_IDS.includes(init.view?.screen as ScreenId) ? (init.view?.screen as ScreenId) : "reduction";
  return {
    designPath: init.designPath,
    outDir: init.outDir,
    sessionPath: init.sessionPath,
    base: null,
    overrides,
    savedOverrides: { ...overrides },
    history: [],
    options: init.options ?? { materials: [], families: [], processes: [] },
    screen,
    overlay: null,
    status: null,
    schemeCursor: 0,
    mapQuantity: init.view?.mapQuantity ?? "level",
    cursor: { i: init.view?.cursorI ?? 0, j: init.view?.cursorJ ?? 0 },
    cursorResumed: init.view?.cursorI !== undefined && init.view?.cursorJ !== undefined,
    mapArea: init.mapArea ?? { width: 40, height: 12 },
    levelCursor: 0,
    flagCursor: 0,
    listRows: 10,
    planWanted: 1,
    planSeq: 0,
    plan: null,
    planError: null,
    computing: { stage: "load", fraction: 0 },
    schemes: null,
    schemesError: null,
    exportWanted: null,
    saveWanted: false,
    quitWanted: false,
    exitNow: false,
  };
}

/** The settings in force: the design's, with the designer's overrides on top (null before loading). */
export function effectiveSettings(state: SessionState): PlanSettings | null {
  const base = state.base ?? state.plan?.settings ?? null;
  if (!base) return null;
  const out = { ...base } as PlanSettings;
  for (const [k, v] of Object.entries(state.overrides)) if (v !== undefined) (out as unknown as Record<string, unknown>)[k] = v;
  return out;
}

/** Overrides without undefined entries, keys sorted: a canonical form for comparison and saving. */
export function canonicalOverrides(o: PlanOverrides): PlanOverrides {
  const out: Record<string, unknown> = {};
  for (const k of Object.keys(o).sort()) {
    const v = (o as Record<string, unknown>)[k];
    if (v !== undefined) out[k] = Array.isArray(v) ? [...v].sort() : v;
  }
  return out as PlanOverrides;
}

/** True when two sets of overrides ask for the same plan. */
export function sameOverrides(a: PlanOverrides, b: PlanOverrides): boolean {
  return JSON.stringify(canonicalOverrides(a)) === JSON.stringify(canonicalOverrides(b));
}

/** True when the designer changed choices since the last save (or since opening). */
export function hasUnsavedChanges(state: SessionState): boolean {
  return !sameOverrides(state.overrides, state.savedOverrides);
}

/** True while the plan on screen is not the one for the current choices. */
export function planIsStale(state: SessionState): boolean {
  return state.planSeq !== state.planWanted;
}

/** Where the designer is looking, for the session file. */
export function sessionView(state: SessionState): { screen: string; mapQuantity: string; cursorI: number; cursorJ: number } {
  return { screen: state.screen, mapQuantity: state.mapQuantity, cursorI: state.cursor.i, cursorJ: state.cursor.j };
}
