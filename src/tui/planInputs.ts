/** What a plan is made from: the design, its tensor field and the catalogs, read once per session. */
import { loadDesign } from "../io/design/loadDesign.js";
import { loadFieldForDesign } from "../io/fieldCsv.js";
import { loadMaterialCatalog } from "../io/materialCatalog.js";
import { loadProcessCatalog } from "../io/processCatalog.js";
import type { TensorField } from "../field/tensorField.js";
import type { PlanCatalogs } from "../plan/runPlan.js";
import type { Design } from "../io/design/designSchema.js";

export interface PlanInputs {
  design: Design;
  field: TensorField;
  catalogs: PlanCatalogs;
}

/** Read the design (absolute path, so reports name it as `plan --session` does), field and catalogs. */
export async function loadPlanInputs(designPath: string, cwd: string): Promise<PlanInputs> {
  const design = await loadDesign(designPath, cwd);
  const [field, materials, processes] = await Promise.all([loadFieldForDesign(design), loadMaterialCatalog(), loadProcessCatalog()]);
  return { design, field, catalogs: { materials, processes } };
}
