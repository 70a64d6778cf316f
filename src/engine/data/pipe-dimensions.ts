/**
 * Pipe and tube dimensions by standard.
 *
 * - ASME B36.10M-2018 "Welded and Seamless Wrought Steel Pipe" and ASME
 *   B36.19M-2018 "Stainless Steel Pipe": outside diameters and nominal walls in
 *   inches as the standards tabulate them (the metric columns are these values ×
 *   25.4, rounded). Transcribed from memory; checked against the python3-fluids
 *   1.0.22 B36.10M/B36.19M tables (see __tests__/pipe-dimensions.test.ts).
 * - ASTM B88-20 seamless copper water tube, Types K and L: OD = nominal + 1/8 in;
 *   walls from the standard's Table 1 as reproduced in trade size charts.
 * - ASTM A270 sanitary stainless tube (3-A sizes): outside diameter equals the nominal size
 *   in inches; walls 0.065 in (16 gauge) up to 3 in, 0.083 in (14 gauge) at 4 in, 0.109 in
 *   (12 gauge) at 6 in — the usual dairy and brewery tube, from memory.
 * - DIN 11850 series 2 hygienic stainless tube (metric food plants): outside diameter ×
 *   wall, from memory.
 * - EN 10220:2002 seamless and welded steel tubes, series 1 outside diameters
 *   (mm); the walls offered are the standard's preferred wall series within a
 *   range usual for each size (range from memory), the default is a common
 *   process-pipe wall (common practice).
 */

export type PipeStandardId =
  | 'ASME-B36.10M'
  | 'ASME-B36.19M'
  | 'ASTM-B88-L'
  | 'ASTM-B88-K'
  | 'EN-10220'
  | 'ASTM-A270-SANITARY'
  | 'DIN-11850-2';

export interface PipeSizeEntry {
  /** Size as written in the trade: "1-1/2" (NPS or copper nominal) or "DN50". */
  readonly size: string;
  /** Nominal size in inches (NPS / copper nominal); metric DN for EN 10220. */
  readonly nominalInch: number;
  readonly dn: number;
  readonly outerDiameterM: number;
  /** Wall thickness by schedule (or tube type / wall label), m. */
  readonly wallsM: Readonly<Record<string, number>>;
  readonly defaultSchedule: string;
}

export interface PipeStandard {
  readonly id: PipeStandardId;
  readonly name: string;
  readonly defaultMaterial: 'carbon-steel' | 'stainless-steel' | 'copper';
  readonly sizes: readonly PipeSizeEntry[];
}

const IN = 0.0254;

// NPS, DN, OD (in), then walls (in) per schedule; null = not listed for that size.
const NPS_ROWS: readonly (readonly [string, number, number, number])[] = [
  ['1/2', 0.5, 15, 0.84],
  ['3/4', 0.75, 20, 1.05],
  ['1', 1, 25, 1.315],
  ['1-1/4', 1.25, 32, 1.66],
  ['1-1/2', 1.5, 40, 1.9],
  ['2', 2, 50, 2.375],
  ['2-1/2', 2.5, 65, 2.875],
  ['3', 3, 80, 3.5],
  ['3-1/2', 3.5, 90, 4.0],
  ['4', 4, 100, 4.5],
  ['5', 5, 125, 5.563],
  ['6', 6, 150, 6.625],
  ['8', 8, 200, 8.625],
  ['10', 10, 250, 10.75],
  ['12', 12, 300, 12.75],
  ['14', 14, 350, 14],
  ['16', 16, 400, 16],
  ['18', 18, 450, 18],
  ['20', 20, 500, 20],
  ['24', 24, 600, 24],
];

const B3610_WALLS_IN: Readonly<Record<string, readonly (number | null)[]>> = {
  '10': [0.083, 0.083, 0.109, 0.109, 0.109, 0.109, 0.12, 0.12, 0.12, 0.12, 0.134, 0.134, 0.148, 0.165, 0.18, 0.25, 0.25, 0.25, 0.25, 0.25],
  '40': [0.109, 0.113, 0.133, 0.14, 0.145, 0.154, 0.203, 0.216, 0.226, 0.237, 0.258, 0.28, 0.322, 0.365, 0.406, 0.438, 0.5, 0.562, 0.594, 0.688],
  '80': [0.147, 0.154, 0.179, 0.191, 0.2, 0.218, 0.276, 0.3, 0.318, 0.337, 0.375, 0.432, 0.5, 0.594, 0.688, 0.75, 0.844, 0.938, 1.031, 1.219],
  '160': [0.188, 0.219, 0.25, 0.25, 0.281, 0.344, 0.375, 0.438, null, 0.531, 0.625, 0.719, 0.906, 1.125, 1.312, 1.406, 1.594, 1.781, 1.969, 2.344],
  STD: [0.109, 0.113, 0.133, 0.14, 0.145, 0.154, 0.203, 0.216, 0.226, 0.237, 0.258, 0.28, 0.322, 0.365, 0.375, 0.375, 0.375, 0.375, 0.375, 0.375],
  XS: [0.147, 0.154, 0.179, 0.191, 0.2, 0.218, 0.276, 0.3, 0.318, 0.337, 0.375, 0.432, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5],
};

const B3619_WALLS_IN: Readonly<Record<string, readonly (number | null)[]>> = {
  '5S': [0.065, 0.065, 0.065, 0.065, 0.065, 0.065, 0.083, 0.083, 0.083, 0.083, 0.109, 0.109, 0.109, 0.134, 0.156, 0.156, 0.165, 0.165, 0.188, 0.218],
  '10S': [0.083, 0.083, 0.109, 0.109, 0.109, 0.109, 0.12, 0.12, 0.12, 0.12, 0.134, 0.134, 0.148, 0.165, 0.18, 0.188, 0.188, 0.188, 0.218, 0.25],
  '40S': [0.109, 0.113, 0.133, 0.14, 0.145, 0.154, 0.203, 0.216, 0.226, 0.237, 0.258, 0.28, 0.322, 0.365, 0.375, 0.375, 0.375, 0.375, 0.375, 0.375],
  '80S': [0.147, 0.154, 0.179, 0.191, 0.2, 0.218, 0.276, 0.3, 0.318, 0.337, 0.375, 0.432, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5],
};

function npsSizes(walls: Readonly<Record<string, readonly (number | null)[]>>, defaultSchedule: string): PipeSizeEntry[] {
  return NPS_ROWS.map(([size, nominalInch, dn, odIn], row) => {
    const wallsM: Record<string, number> = {};
    for (const [schedule, column] of Object.entries(walls)) {
      const wallIn = column[row];
      if (wallIn !== null && wallIn !== undefined) wallsM[schedule] = wallIn * IN;
    }
    return { size, nominalInch, dn, outerDiameterM: odIn * IN, wallsM, defaultSchedule };
  });
}

// Copper nominal size, DN equivalent (common practice), Type K wall, Type L wall (in).
const COPPER_ROWS: readonly (readonly [string, number, number, number, number])[] = [
  ['1/4', 0.25, 8, 0.035, 0.03],
  ['3/8', 0.375, 10, 0.049, 0.035],
  ['1/2', 0.5, 15, 0.049, 0.04],
  ['5/8', 0.625, 18, 0.049, 0.042],
  ['3/4', 0.75, 20, 0.065, 0.045],
  ['1', 1, 25, 0.065, 0.05],
  ['1-1/4', 1.25, 32, 0.065, 0.055],
  ['1-1/2', 1.5, 40, 0.072, 0.06],
  ['2', 2, 50, 0.083, 0.07],
  ['2-1/2', 2.5, 65, 0.095, 0.08],
  ['3', 3, 80, 0.109, 0.09],
  ['3-1/2', 3.5, 90, 0.12, 0.1],
  ['4', 4, 100, 0.134, 0.11],
];

function copperSizes(type: 'K' | 'L'): PipeSizeEntry[] {
  return COPPER_ROWS.map(([size, nominalInch, dn, wallK, wallL]) => ({
    size,
    nominalInch,
    dn,
    outerDiameterM: (nominalInch + 0.125) * IN,
    wallsM: { [type]: (type === 'K' ? wallK : wallL) * IN },
    defaultSchedule: type,
  }));
}

// EN 10220 preferred wall series (mm) and, per size: DN, OD mm, min wall, max wall, default wall.
const EN_WALL_SERIES_MM = [1.6, 1.8, 2.0, 2.3, 2.6, 2.9, 3.2, 3.6, 4.0, 4.5, 5.0, 5.6, 6.3, 7.1, 8.0, 8.8, 10.0, 11.0, 12.5];
const EN_ROWS: readonly (readonly [number, number, number, number, number])[] = [
  [15, 21.3, 1.6, 4.0, 2.0],
  [20, 26.9, 1.6, 4.5, 2.3],
  [25, 33.7, 1.6, 5.0, 2.6],
  [32, 42.4, 1.6, 5.6, 2.6],
  [40, 48.3, 1.6, 6.3, 2.6],
  [50, 60.3, 1.6, 7.1, 2.9],
  [65, 76.1, 1.6, 8.0, 2.9],
  [80, 88.9, 1.6, 8.8, 3.2],
  [100, 114.3, 1.8, 11.0, 3.6],
  [125, 139.7, 2.0, 12.5, 4.0],
  [150, 168.3, 2.0, 12.5, 4.5],
  [200, 219.1, 2.6, 12.5, 6.3],
  [250, 273.0, 2.9, 12.5, 6.3],
  [300, 323.9, 2.9, 12.5, 7.1],
];

function enSizes(): PipeSizeEntry[] {
  return EN_ROWS.map(([dn, odMm, minWall, maxWall, defaultWall]) => {
    const wallsM: Record<string, number> = {};
    for (const wall of EN_WALL_SERIES_MM) {
      if (wall >= minWall && wall <= maxWall) wallsM[wall.toFixed(1)] = wall / 1000;
    }
    return {
      size: `DN${dn}`,
      nominalInch: dn / 25,
      dn,
      outerDiameterM: odMm / 1000,
      wallsM,
      defaultSchedule: defaultWall.toFixed(1),
    };
  });
}

// Sanitary OD tube: nominal inch (= OD), DN equivalent (common practice), default wall key, walls (in).
const A270_ROWS: readonly (readonly [string, number, number, string, Readonly<Record<string, number>>])[] = [
  ['1/2', 0.5, 10, '16GA', { '16GA': 0.065 }],
  ['3/4', 0.75, 15, '16GA', { '16GA': 0.065 }],
  ['1', 1, 25, '16GA', { '16GA': 0.065 }],
  ['1-1/2', 1.5, 40, '16GA', { '16GA': 0.065 }],
  ['2', 2, 50, '16GA', { '16GA': 0.065 }],
  ['2-1/2', 2.5, 65, '16GA', { '16GA': 0.065 }],
  ['3', 3, 80, '16GA', { '16GA': 0.065 }],
  ['4', 4, 100, '14GA', { '14GA': 0.083, '16GA': 0.065 }],
  ['6', 6, 150, '12GA', { '12GA': 0.109 }],
];

function sanitarySizes(): PipeSizeEntry[] {
  return A270_ROWS.map(([size, nominalInch, dn, defaultSchedule, walls]) => ({
    size,
    nominalInch,
    dn,
    outerDiameterM: nominalInch * IN,
    wallsM: Object.fromEntries(Object.entries(walls).map(([k, w]) => [k, w * IN])),
    defaultSchedule,
  }));
}

// DIN 11850 series 2: DN, OD mm, wall mm.
const DIN11850_ROWS: readonly (readonly [number, number, number])[] = [
  [10, 13, 1.5],
  [15, 19, 1.5],
  [20, 23, 1.5],
  [25, 29, 1.5],
  [32, 35, 1.5],
  [40, 41, 1.5],
  [50, 53, 1.5],
  [65, 70, 2],
  [80, 85, 2],
  [100, 104, 2],
  [125, 129, 2],
  [150, 154, 2],
];

function din11850Sizes(): PipeSizeEntry[] {
  return DIN11850_ROWS.map(([dn, odMm, wallMm]) => ({
    size: `DN${dn}`,
    nominalInch: dn / 25,
    dn,
    outerDiameterM: odMm / 1000,
    wallsM: { [wallMm.toFixed(1)]: wallMm / 1000 },
    defaultSchedule: wallMm.toFixed(1),
  }));
}

export const PIPE_STANDARDS: readonly PipeStandard[] = [
  { id: 'ASME-B36.10M', name: 'ASME B36.10M welded and seamless steel pipe', defaultMaterial: 'carbon-steel', sizes: npsSizes(B3610_WALLS_IN, '40') },
  { id: 'ASME-B36.19M', name: 'ASME B36.19M stainless steel pipe', defaultMaterial: 'stainless-steel', sizes: npsSizes(B3619_WALLS_IN, '10S') },
  { id: 'ASTM-B88-L', name: 'ASTM B88 copper water tube, Type L', defaultMaterial: 'copper', sizes: copperSizes('L') },
  { id: 'ASTM-B88-K', name: 'ASTM B88 copper water tube, Type K', defaultMaterial: 'copper', sizes: copperSizes('K') },
  { id: 'EN-10220', name: 'EN 10220 steel tube (metric)', defaultMaterial: 'carbon-steel', sizes: enSizes() },
  { id: 'ASTM-A270-SANITARY', name: 'ASTM A270 sanitary stainless tube (OD sizes)', defaultMaterial: 'stainless-steel', sizes: sanitarySizes() },
  { id: 'DIN-11850-2', name: 'DIN 11850 hygienic stainless tube, series 2 (metric)', defaultMaterial: 'stainless-steel', sizes: din11850Sizes() },
];

export const PIPE_STANDARD_IDS = [
  'ASME-B36.10M',
  'ASME-B36.19M',
  'ASTM-B88-L',
  'ASTM-B88-K',
  'EN-10220',
  'ASTM-A270-SANITARY',
  'DIN-11850-2',
] as const satisfies readonly PipeStandardId[];
