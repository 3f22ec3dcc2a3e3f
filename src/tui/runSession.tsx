/**
 * Start the interactive session in the terminal and resolve when the designer quits. Loaded
 * lazily by `cellwright session` (ink and react are never loaded by scripted commands).
 */
import { render } from "ink";
import type { PlanOverrides } from "../plan/planTypes.js";
import type { SessionView } from "../io/sessionFile.js";
import { SessionApp } from "./SessionApp.js";
import { createSessionServices } from "./sessionServices.js";
import { initialSessionState, hasUnsavedChanges, type SessionState } from "./state/sessionState.js";

export interface RunSessionOptions {
  designPath: string;
  cwd: string;
  outDir: string;
  sessionPath: string;
  overrides: PlanOverrides;
  view?: SessionView;
  /** a line shown under the first screen (e.g. "resumed from …") */
  note?: string;
}

const ENTER_ALT_SCREEN = "\u001b[?1049h\u001b[H";
const LEAVE_ALT_SCREEN = "\u001b[?1049l";

/** Run the session; says whether the designer left changes unsaved (for the closing line). */
export async function runSession(opts: RunSessionOptions): Promise<{ unsaved: boolean }> {
  const services = createSessionServices({ designPath: opts.designPath, cwd: opts.cwd, outDir: opts.outDir, sessionPath: opts.sessionPath });
  const initial = initialSessionState({
    designPath: opts.designPath,
    outDir: opts.outDir,
    sessionPath: opts.sessionPath,
    overrides: opts.overrides,
    view: opts.view,
  });
  if (opts.note) initial.status = opts.note;
  let final: SessionState | null = null;
  const alt = process.stdout.isTTY === true;
  if (alt) process.stdout.write(ENTER_ALT_SCREEN);
  const restore = (): void => {
    if (alt) process.stdout.write(LEAVE_ALT_SCREEN);
  };
  process.once("exit", restore);
  try {
    const instance = render(
      <SessionApp initial={initial} services={services} inputActive={process.stdin.isTTY === true} onExit={(s) => (final = s)} />,
      { exitOnCtrlC: false, patchConsole: true },
    );
    await instance.waitUntilExit();
  } finally {
    process.off("exit", restore);
    restore();
    await services.close();
  }
  const last = final as SessionState | null;
  return { unsaved: last !== null && hasUnsavedChanges(last) };
}
