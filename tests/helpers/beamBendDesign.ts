/**
 * A quarter-turn beam bend design (inner radius 60 mm, outer 80 mm, referenced to the outer
 * radius; Ez, isotropic reduction in a background of index 1.2): the demo scenario the plan and
 * build-list tests make at different pitches and frequencies.
 */
export function beamBendDesign(o: { name: string; frequency: string; pitch: string; materials?: string[] }): Record<string, unknown> {
  return {
    name: o.name,
    frequency: o.frequency,
    transform: { kind: "beam-bend", innerRadius: "60 mm", outerRadius: "80 mm", angle: "90 deg", referenceRadius: "80 mm" },
    grid: { pitch: o.pitch },
    polarization: "Ez",
    reduction: { scheme: "isotropic", backgroundIndex: 1.2 },
    ...(o.materials ? { realization: { materials: o.materials, lattice: "cubic", tolerance: 0.03 } } : {}),
  };
}
