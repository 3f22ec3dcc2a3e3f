/**
 * Keys inside the picker overlay (allowed materials, allowed families, fabrication process).
 * Choices are made on a working copy and applied (one recomputation) on Enter.
 */
import type { PlanOverrides } from "../../plan/planTypes.js";
import type { CommandId } from "./keyBindings.js";
import type { Overlay, PickOption, SessionState } from "./sessionState.js";
import { changeChoices } from "./changeChoices.js";

type Picker = Extract<Overlay, { kind: "picker" }>;

/** Items of a picker: catalog ids; the process picker starts with "no process limit" (id ""). */
export function pickerItems(state: SessionState, field: Picker["field"]): PickOption[] {
  if (field === "process") return [{ id: "", label: "no process limit (the report says so)" }, ...state.options.processes];
  return state.options[field];
}

/** Is item `id` allowed in the working copy (null = the catalog default: every item)? */
export function pickerAllows(picker: Picker, id: string): boolean {
  if (picker.field === "process") return (picker.chosen ?? "") === id;
  return picker.chosen === null || picker.chosen.includes(id);
}

export function pickerCommand(state: SessionState, picker: Picker, command: CommandId): SessionState {
  const items = pickerItems(state, picker.field);
  const n = items.length;
  switch (command) {
    case "up":
    case "down": {
      const cursor = Math.max(0, Math.min(n - 1, picker.cursor + (command === "up" ? -1 : 1)));
      return { ...state, overlay: { ...picker, cursor } as Picker };
    }
    case "toggle": {
      const item = items[picker.cursor];
      if (!item) return state;
      if (picker.field === "process") return { ...state, overlay: { ...picker, chosen: item.id === "" ? null : item.id } };
      const all = items.map((x) => x.id);
      const current = picker.chosen ?? all;
      const next = current.includes(item.id) ? current.filter((x) => x !== item.id) : [...current, item.id];
      if (next.length === 0) return { ...state, status: `at least one of the ${picker.field} must stay allowed` };
      const chosen = next.length === all.length && all.every((x) => next.includes(x)) ? null : all.filter((x) => next.includes(x));
      return { ...state, overlay: { ...picker, chosen } };
    }
    case "allowAll": {
      const base = state.base;
      if (!base) return state;
      if (picker.field === "process") return { ...state, overlay: { ...picker, chosen: base.process } };
      const own = base[picker.field];
      return { ...state, overlay: { ...picker, chosen: own ? [...own] : null } };
    }
    case "choose": {
      let patch: PlanOverrides;
      let label: string;
      if (picker.field === "process") {
        const item = items[picker.cursor];
        const process = item && item.id !== "" ? item.id : null;
        patch = { process };
        label = `process ${process ?? "none (no process limit)"}`;
      } else {
        patch = { [picker.field]: picker.chosen } as PlanOverrides;
        label = `${picker.field}: ${picker.chosen === null ? "every catalog entry" : `${picker.chosen.length} allowed`}`;
      }
      return changeChoices({ ...state, overlay: null }, patch, label);
    }
    case "close":
      return { ...state, overlay: null, status: "nothing changed" };
    default:
      return state;
  }
}
