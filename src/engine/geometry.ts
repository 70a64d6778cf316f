/**
 * Equivalent thickness of pipe insulation, r₂·ln(r₂/r₁): the flat-slab thickness
 * with the same resistance per unit of outer area (ASTM C680 / ASTM C585 usage).
 *
 * @param innerDiameterM insulation inner diameter (the pipe OD), m
 * @param outerDiameterM insulation outer diameter, m
 */
export function equivalentThicknessM(innerDiameterM: number, outerDiameterM: number): number {
  const r2 = outerDiameterM / 2;
  return r2 * Math.log(outerDiameterM / innerDiameterM);
}
