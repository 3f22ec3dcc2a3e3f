/** The verify module's quantity formatting is the tool's one (src/core/formatQuantity.ts). */
export { formatLength, formatFrequency } from "../core/formatQuantity.js";
