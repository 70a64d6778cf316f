/**
 * ASTM C585 actual sizes of inch-series pipe insulation. C585 makes pipe insulation in a
 * fixed list of outside diameters so jackets and the next layer fit; the actual thickness is
 * half the gap between that outside diameter and the pipe, not the nominal thickness.
 *
 * The outside diameters (in) are those of the standard's table for pipe and tube
 * insulation — from memory: the NPS pipe outside diameters with a few between them, then
 * every inch. A nominal thickness takes the smallest outside diameter at least the pipe OD
 * plus twice the nominal less 1/16 in (the shortfall we take C585 to allow — from memory).
 * Checked against the actual outside diameters behind Frankel, Facility Piping Systems
 * Handbook Table 5.6 in __tests__/pipe-dimensions.test.ts.
 */
const OUTSIDE_DIAMETERS_IN = [
  1.315, 1.66, 1.9, 2.375, 2.875, 3.5, 4.0, 4.5, 5.0, 5.563, 6.625, 7.625, 8.625, 9.625, 10.75, 11.75, 12.75, 13.75,
  14.75, 15.75, 16.75, 17.75, 18.75, 19.75, 20.75, 21.75, 22.75, 23.75, 24.75, 25.75, 26.75, 27.75, 28.75, 29.75, 30.75,
  31.75, 32.75, 33.75, 34.75, 35.75, 36.75,
] as const;

const IN = 0.0254;
const ALLOWED_SHORTFALL_IN = 1 / 16;

/**
 * Actual outer diameter of inch-series insulation of a nominal thickness on a pipe, m;
 * beyond the table, pipe OD plus twice the nominal.
 */
export function c585OuterDiameterM(pipeOuterDiameterM: number, nominalThicknessM: number): number {
  const neededIn = (pipeOuterDiameterM + 2 * nominalThicknessM) / IN - 2 * ALLOWED_SHORTFALL_IN;
  for (const od of OUTSIDE_DIAMETERS_IN) if (od >= neededIn - 1e-9) return od * IN;
  return pipeOuterDiameterM + 2 * nominalThicknessM;
}

/** Actual thickness of inch-series insulation of a nominal thickness on a pipe, m. */
export function c585ActualThicknessM(pipeOuterDiameterM: number, nominalThicknessM: number): number {
  return (c585OuterDiameterM(pipeOuterDiameterM, nominalThicknessM) - pipeOuterDiameterM) / 2;
}
