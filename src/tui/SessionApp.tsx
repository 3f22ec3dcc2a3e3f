/**
 * The interactive session's root component: a reducer over `SessionState`, the key handler, and
 * the effects that ask the services (planner, scheme comparison, writes) for what the state wants.
 * Everything it draws comes from pure selectors in state/.
 */
import { Box, Text, useApp, useInput, useStdout } from "ink";
import { useEffect, useReducer, useRef, useState } from "react";
import type { Plan, PlanOverrides, PlanSettings, PlanStage } from "../plan/planTypes.js";
import type { KeyLike } from "./state/keyBindings.js";
import { keyNames } from "./state/keyBurst.js";
import { findQuantity } from "./state/mapQuantities.js";
import { overlayScope, sessionReducer } from "./state/sessionReducer.js";
import { effectiveSettings, sessionView, type SchemeTableView, type SessionState } from "./state/sessionState.js";
import { Footer } from "./components/Footer.js";
import { Header } from "./components/Header.js";
import { packLegend } from "./components/HeatMap.js";
import { ConfirmQuit, HelpOverlay, Notice, PickerOverlay } from "./components/Overlays.js";
import { FlagsScreen } from "./screens/FlagsScreen.js";
import { LevelsScreen, levelListRows } from "./screens/LevelsScreen.js";
import { legendFor, MapScreen, recordWidth } from "./screens/MapScreen.js";
import { ReductionScreen } from "./screens/ReductionScreen.js";

/** What the session asks of the world; the command wires the real planner, tests wire fakes. */
export interface SessionServices {
  /** read the design and the catalogs: the design's own settings and the picker lists */
  open(): Promise<{ base: PlanSettings; options: SessionState["options"] }>;
  /** a plan for the design with these overrides; must not block the event loop for long */
  plan(overrides: PlanOverrides, onProgress: (stage: PlanStage, fraction: number) => void): Promise<Plan>;
  /** the scheme comparison for the settings' polarization, reduced with the background index of `overrides` as plans are (givenBackgroundIndex) */
  schemes(settings: PlanSettings, overrides: PlanOverrides): Promise<SchemeTableView>;
  /** write every output of `plan` and the session file; returns the paths written */
  exportPlan(plan: Plan, overrides: PlanOverrides, view: ReturnType<typeof sessionView>, options?: { layout?: boolean }): Promise<string[]>;
  /** write only the session file; returns its path */
  saveChoices(overrides: PlanOverrides, view: ReturnType<typeof sessionView>): Promise<string>;
}

export interface SessionAppProps {
  initial: SessionState;
  services: SessionServices;
  /** read keys (false without a terminal: ink's raw mode needs one) */
  inputActive: boolean;
  /** fixed size (tests); otherwise the terminal's, following resizes */
  size?: { columns: number; rows: number };
  /** called with the final state when the session ends */
  onExit?: (state: SessionState) => void;
}

function message(err: unknown): string {
  const e = err as { issues?: { where: string; message: string }[]; message?: string };
  if (e?.issues?.length) return e.issues.map((i) => `${i.where}: ${i.message}`).join("; ");
  return e?.message ?? String(err);
}

function useTerminalSize(fixed?: { columns: number; rows: number }): { columns: number; rows: number } {
  const { stdout } = useStdout();
  const read = () => ({ columns: fixed?.columns ?? (stdout.columns || 80), rows: fixed?.rows ?? (stdout.rows || 24) });
  const [size, setSize] = useState(read);
  useEffect(() => {
    if (fixed) return;
    const onResize = () => setSize(read());
    stdout.on("resize", onResize);
    return () => {
      stdout.off("resize", onResize);
    };
  }, [stdout, fixed?.columns, fixed?.rows]);
  return size;
}

// three header lines, a rule, two footer lines, and one spare row: a frame as tall as the terminal
// makes ink clear the whole screen on every update
const CHROME_ROWS = 7;

export function SessionApp({ initial, services, inputActive, size, onExit }: SessionAppProps) {
  const [state, dispatch] = useReducer(sessionReducer, initial);
  const stateRef = useRef(state);
  stateRef.current = state;
  const { exit } = useApp();
  const { columns, rows } = useTerminalSize(size);
  const width = Math.max(40, columns);
  const bodyHeight = Math.max(6, rows - CHROME_ROWS);

  // keys → reducer, every key of a chunk in order; the reducer resolves each against the state
  // left by the one before (an overlay opened by the first key of a burst takes the next ones)
  useInput(
    (input: string, key: KeyLike) => {
      for (const name of keyNames(input, key)) dispatch({ type: "key", name });
    },
    { isActive: inputActive },
  );

  // read the design once
  useEffect(() => {
    let live = true;
    services.open().then(
      (r) => live && dispatch({ type: "designLoaded", base: r.base, options: r.options }),
      (err) => live && dispatch({ type: "loadFailed", message: message(err) }),
    );
    return () => {
      live = false;
    };
  }, [services]);

  // a plan for every change of choices (stale answers are dropped by the reducer)
  useEffect(() => {
    if (!state.base) return;
    const seq = state.planWanted;
    let lastSent = 0;
    let lastStage = "";
    services
      .plan(state.overrides, (stage, fraction) => {
        const now = Date.now();
        if (stage === lastStage && now - lastSent < 80 && fraction < 1) return;
        lastSent = now;
        lastStage = stage;
        dispatch({ type: "planProgress", seq, stage, fraction });
      })
      .then(
        (plan) => dispatch({ type: "planReady", seq, plan }),
        (err) => dispatch({ type: "planFailed", seq, message: message(err) }),
      );
  }, [state.base, state.planWanted, services]);

  // the scheme table follows the polarization and the background index
  const settings = effectiveSettings(state);
  const schemeKey = settings ? `${settings.polarization}|${settings.backgroundIndex}|${state.overrides.backgroundIndex !== undefined}|${settings.unitAxis}` : "";
  useEffect(() => {
    if (!settings) return;
    let live = true;
    services.schemes(settings, state.overrides).then(
      (table) => live && dispatch({ type: "schemesReady", table }),
      (err) => live && dispatch({ type: "schemesFailed", polarization: settings.polarization, message: message(err) }),
    );
    return () => {
      live = false;
    };
  }, [schemeKey, services]);

  // export once the plan of the wanted choices is on screen
  const exporting = useRef<number | null>(null);
  useEffect(() => {
    const want = state.exportWanted;
    if (want === null || exporting.current === want) return;
    if (state.planError && state.planSeq >= want) {
      dispatch({ type: "exportFailed", message: `no plan to export: ${state.planError}` });
      return;
    }
    if (state.planSeq !== want || !state.plan) return;
    exporting.current = want;
    const overrides = state.overrides;
    services.exportPlan(state.plan, overrides, sessionView(state), { layout: state.exportLayout === true }).then(
      (paths) => {
        exporting.current = null;
        dispatch({ type: "exportDone", paths, overrides });
      },
      (err) => {
        exporting.current = null;
        dispatch({ type: "exportFailed", message: message(err) });
      },
    );
  }, [state.exportWanted, state.planSeq, state.plan, state.planError, services]);

  // save the choices alone
  useEffect(() => {
    if (!state.saveWanted) return;
    const overrides = state.overrides;
    services.saveChoices(overrides, sessionView(state)).then(
      (path) => dispatch({ type: "saveDone", path, overrides }),
      (err) => dispatch({ type: "saveFailed", message: message(err) }),
    );
  }, [state.saveWanted, services]);

  // the map's drawing area follows the terminal size and the legend's height
  const mapWidth = Math.max(10, width - recordWidth(width, state.plan?.grid.nx ?? 0) - 2);
  const legendRows = state.plan ? packLegend(legendFor(findQuantity(state.plan, state.mapQuantity), true, mapWidth), mapWidth).length : 2;
  const mapHeight = Math.max(3, bodyHeight - 2 - legendRows);
  const listRows = state.screen === "levels" ? levelListRows(bodyHeight) : Math.max(3, bodyHeight - 3);
  useEffect(() => {
    const a = stateRef.current.mapArea;
    if (a.width !== mapWidth || a.height !== mapHeight || stateRef.current.listRows !== listRows) {
      dispatch({ type: "resize", mapArea: { width: mapWidth, height: mapHeight }, listRows });
    }
  }, [mapWidth, mapHeight, listRows]);

  // leave when asked
  useEffect(() => {
    if (!state.exitNow) return;
    onExit?.(state);
    exit();
  }, [state.exitNow]);

  const o = state.overlay;
  let body;
  if (o?.kind === "help") body = <HelpOverlay offset={o.offset} width={width} height={bodyHeight} />;
  else if (o?.kind === "picker") body = <PickerOverlay state={state} picker={o} width={width} height={bodyHeight} />;
  else if (o?.kind === "confirmQuit") body = <ConfirmQuit state={state} />;
  else if (o?.kind === "notice") body = <Notice title={o.title} lines={o.lines} tone={o.tone} />;
  else if (state.screen === "reduction") body = <ReductionScreen state={state} width={width} height={bodyHeight} />;
  else if (state.screen === "map") body = <MapScreen state={state} width={width} height={bodyHeight} />;
  else if (state.screen === "levels") body = <LevelsScreen state={state} width={width} height={bodyHeight} />;
  else body = <FlagsScreen state={state} width={width} height={bodyHeight} />;

  const scope = overlayScope(state);
  return (
    <Box flexDirection="column" width={width}>
      <Header state={state} width={width} />
      <Text color="gray">{"─".repeat(width)}</Text>
      <Box height={bodyHeight} flexDirection="column" overflow="hidden">
        {body}
      </Box>
      <Footer state={state} width={width} scopes={scope ? [scope] : [state.screen, "global"]} />
    </Box>
  );
}
