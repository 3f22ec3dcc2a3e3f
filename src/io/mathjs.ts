/** Lazy, shared mathjs instance: only commands that need it pay its load time. */
let mathPromise: Promise<any> | null = null;

export function getMath(): Promise<any> {
  if (!mathPromise) mathPromise = import("mathjs").then((m: any) => m.create(m.all, {}));
  return mathPromise;
}
