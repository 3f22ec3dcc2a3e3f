/** Colours of the session's chrome (the heat map's own colours live in state/heatMap.ts). */
export const THEME = {
  accent: "cyan",
  pick: "green",
  warn: "yellow",
  error: "red",
  dim: "gray",
  ok: "green",
} as const;

/** Words for the planner's stages in the progress line. */
export const STAGE_WORDS: Record<string, string> = {
  load: "reading the design",
  schemes: "comparing schemes",
  reduce: "reducing the tensors",
  quantize: "grouping cells into levels",
  regions: "finding regions",
  match: "matching recipes",
  flags: "flagging cells",
  figures: "device figures",
};

/** Cut or pad text to exactly `width` characters (an ellipsis marks a cut). */
export function fit(text: string, width: number): string {
  if (width <= 0) return "";
  const chars = [...text];
  if (chars.length <= width) return text + " ".repeat(width - chars.length);
  return chars.slice(0, Math.max(0, width - 1)).join("") + "…";
}
