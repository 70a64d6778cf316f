/**
 * Fittings by type and size, as bare outside surface area.
 *
 * Dimensions: ASME B16.5 Class 150 flanges (outside diameter, thickness) and ASME B16.10
 * Class 150 flanged gate valves (face-to-face), in inches — from memory. On these, our own
 * geometric model (common practice, stated so it can be checked): a flange shows its back
 * face (an annulus from the pipe to the flange rim) and its rim; a flanged valve is its two
 * end flanges and the two pipe flanges they bolt to, a body (a cylinder three quarters of the
 * flange diameter across, between the flanges) and a bonnet (a cylinder half the flange
 * diameter across and one and a half flange diameters tall, with its bonnet flange); a
 * screwed valve is a body 1.6 pipe diameters across and 2.5 long with the same bonnet on a
 * pipe-sized scale; a Y-strainer is a flanged valve's flanges and body with a screen leg in
 * place of the bonnet; a steam trap is a body four pipe diameters across and tall.
 *
 * A fitting's heat is its area times the heat flux of the pipe it sits on, i.e. an
 * equivalent length of that pipe (area ÷ π·OD). Checked against US DOE Steam Tip Sheet #17
 * (valve-cover savings by size and temperature) and Tip Sheet #2 (a 6-in gate valve has
 * more than 6 ft²) in __tests__/fittings.test.ts, with the deviations recorded there.
 *
 * A removable insulated cover is taken as the fitting's equivalent length insulated like
 * the pipe.
 */

const IN = 0.0254;

/** Kinds of fitting the engine knows. */
export const FITTING_TYPES = [
  { id: 'valve-flanged', name: 'Flanged valve (with the pipe flanges it bolts to)' },
  { id: 'valve-screwed', name: 'Screwed valve' },
  { id: 'flange-pair', name: 'Pair of flanges' },
  { id: 'strainer', name: 'Strainer (flanged Y-type)' },
  { id: 'steam-trap', name: 'Steam trap' },
] as const;

export type FittingTypeId = (typeof FITTING_TYPES)[number]['id'];
export const FITTING_TYPE_IDS = FITTING_TYPES.map((f) => f.id) as [FittingTypeId, ...FittingTypeId[]];

// NPS, pipe OD (in), B16.5 Class 150 flange OD (in), flange thickness (in), B16.10 Class 150 gate face-to-face (in).
const FLANGE_ROWS: readonly (readonly [number, number, number, number, number])[] = [
  [0.5, 0.84, 3.5, 0.44, 4.25],
  [0.75, 1.05, 3.88, 0.5, 4.62],
  [1, 1.315, 4.25, 0.56, 5.0],
  [1.25, 1.66, 4.62, 0.62, 5.5],
  [1.5, 1.9, 5.0, 0.69, 6.5],
  [2, 2.375, 6.0, 0.75, 7.0],
  [2.5, 2.875, 7.0, 0.88, 7.5],
  [3, 3.5, 7.5, 0.94, 8.0],
  [4, 4.5, 9.0, 0.94, 9.0],
  [5, 5.563, 10.0, 0.94, 10.0],
  [6, 6.625, 11.0, 1.0, 10.5],
  [8, 8.625, 13.5, 1.12, 11.5],
  [10, 10.75, 16.0, 1.19, 13.0],
  [12, 12.75, 19.0, 1.25, 14.0],
  [14, 14.0, 21.0, 1.38, 15.0],
  [16, 16.0, 23.5, 1.44, 16.0],
  [18, 18.0, 25.0, 1.56, 17.0],
  [20, 20.0, 27.5, 1.69, 18.0],
  [24, 24.0, 32.0, 1.88, 20.0],
];

type FlangeRow = (typeof FLANGE_ROWS)[number];

/**
 * Flange and valve dimensions for a pipe OD, m: linear between table rows, linear past the
 * largest row, and in proportion to the OD below the smallest (a smaller tube, smaller parts).
 */
function dimensionsFor(pipeOuterDiameterM: number): { flangeOdM: number; flangeThicknessM: number; faceToFaceM: number } {
  const odIn = pipeOuterDiameterM / IN;
  const first = FLANGE_ROWS[0] as FlangeRow;
  if (odIn <= first[1]) {
    const scale = odIn / first[1];
    return { flangeOdM: first[2] * scale * IN, flangeThicknessM: first[3] * scale * IN, faceToFaceM: first[4] * scale * IN };
  }
  let i = 0;
  while (i < FLANGE_ROWS.length - 2 && odIn > (FLANGE_ROWS[i + 1] as FlangeRow)[1]) i++;
  const a = FLANGE_ROWS[i] as FlangeRow;
  const b = FLANGE_ROWS[i + 1] as FlangeRow;
  const w = (odIn - a[1]) / (b[1] - a[1]);
  const lerp = (k: 2 | 3 | 4) => (a[k] + w * (b[k] - a[k])) * IN;
  return { flangeOdM: lerp(2), flangeThicknessM: lerp(3), faceToFaceM: lerp(4) };
}

/** Back face and rim of one flange, m². */
function flangeAreaM2(pipeOdM: number, flangeOdM: number, thicknessM: number): number {
  return (Math.PI / 4) * (flangeOdM * flangeOdM - pipeOdM * pipeOdM) + Math.PI * flangeOdM * thicknessM;
}

/** A bonnet: a cylinder of diameter d and height h with a flange twice its annulus wide. */
function bonnetAreaM2(d: number, h: number, flangeD: number): number {
  return Math.PI * d * h + (Math.PI / 4) * d * d + 2 * (Math.PI / 4) * (flangeD * flangeD - d * d);
}

/** Bare outside area of one fitting on a pipe of this outside diameter, m². */
export function fittingAreaM2(type: FittingTypeId, pipeOuterDiameterM: number): number {
  const d = pipeOuterDiameterM;
  const { flangeOdM: df, flangeThicknessM: t, faceToFaceM: f2f } = dimensionsFor(d);
  const flange = flangeAreaM2(d, df, t);
  const flangedBody = Math.PI * (0.75 * df) * Math.max(f2f - 2 * t, 0);
  switch (type) {
    case 'flange-pair':
      return 2 * flange;
    case 'valve-flanged':
      return 4 * flange + flangedBody + bonnetAreaM2(0.5 * df, 1.5 * df, 0.8 * df);
    case 'strainer':
      return 4 * flange + flangedBody + Math.PI * (0.5 * df) * df + (Math.PI / 4) * (0.5 * df) * (0.5 * df);
    case 'valve-screwed':
      return Math.PI * (1.6 * d) * (2.5 * d) + bonnetAreaM2(1.0 * d, 3 * d, 1.6 * d);
    case 'steam-trap':
      return Math.PI * (4 * d) * (4 * d) + 2 * (Math.PI / 4) * (4 * d) * (4 * d);
  }
}

/** Equivalent length of bare pipe of the same size, m: the fitting's area over the pipe's π·OD. */
export function fittingEquivalentLengthM(type: FittingTypeId, pipeOuterDiameterM: number): number {
  return fittingAreaM2(type, pipeOuterDiameterM) / (Math.PI * pipeOuterDiameterM);
}
