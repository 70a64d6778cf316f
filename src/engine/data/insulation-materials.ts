/**
 * Pipe insulation materials: design conductivity curves k(T) = a + bT + cT² (T in
 * °C, W/(m·K)), service temperature limits and stock thicknesses.
 *
 * Conductivity: each curve is our own least-squares fit through design points set
 * at or just below the maximum apparent thermal conductivity of the material's
 * ASTM specification, as listed in the NIA Insulation Materials Specification
 * Chart (April 2024) for C534 Grade 1, C552 Grade 6 Type II and C591 Grade 2, and
 * in ASTM C547-17 / C533-17 Table 1 (from memory) for glass fiber, mineral wool
 * and calcium silicate. A curve at the specification ceiling gives a slightly
 * conservative (higher) heat loss than a good product would. The fit points are
 * listed beside each curve so the fit can be redone.
 *
 * Service limits: the ASTM specification's use range (from memory, verify against
 * the standard); a lower limit marked "common practice" is the usual product floor.
 *
 * Stock thicknesses: common practice (typical pipe-section and tube ranges), inch
 * series per ASTM C585 nominal thicknesses, mm series as sold in metric markets.
 *
 * `installedCostFactor` scales the illustrative installed-cost table (see
 * installed-cost-demo.ts) and is itself illustrative.
 */

export interface InsulationMaterial {
  readonly id: string;
  readonly name: string;
  readonly standard: string;
  readonly conductivity: { readonly a: number; readonly b: number; readonly c: number };
  /** The points the curve was fitted through: [mean temperature °C, k W/(m·K)]. */
  readonly fitPoints: readonly (readonly [number, number])[];
  readonly serviceMinC: number;
  readonly serviceMaxC: number;
  /** Which lines the material is normally chosen for. */
  readonly use: 'hot' | 'cold' | 'hot-and-cold';
  readonly thicknessSeriesMm: readonly number[];
  readonly thicknessSeriesIn: readonly number[];
  readonly installedCostFactor: number;
  readonly source: string;
}

export const INSULATION_MATERIALS = [
  {
    id: 'glass-fibre',
    name: 'Glass fiber pipe section',
    standard: 'ASTM C547 Type I',
    conductivity: { a: 0.030762, b: 1.0299e-4, c: 2.4383e-7 },
    fitPoints: [
      [37.78, 0.035],
      [93.33, 0.0425],
      [148.9, 0.0515],
      [204.4, 0.062],
    ],
    serviceMinC: -18,
    serviceMaxC: 454,
    use: 'hot-and-cold',
    thicknessSeriesMm: [20, 25, 30, 40, 50, 60, 70, 80, 90, 100],
    thicknessSeriesIn: [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5],
    installedCostFactor: 0.95,
    source:
      'Fit below ASTM C547-17 Table 1 Type I maxima 0.25/0.31/0.38/0.46 Btu·in/(h·ft²·°F) at 100/200/300/400 °F mean (from memory); use range 0–850 °F (from memory).',
  },
  {
    id: 'mineral-wool',
    name: 'Mineral wool pipe section',
    standard: 'ASTM C547 Type II',
    conductivity: { a: 0.031401, b: 9.4192e-5, c: 1.9986e-7 },
    fitPoints: [
      [37.78, 0.0352],
      [93.33, 0.042],
      [204.4, 0.059],
      [315.6, 0.081],
      [426.7, 0.108],
    ],
    serviceMinC: -18,
    serviceMaxC: 649,
    use: 'hot',
    thicknessSeriesMm: [20, 25, 30, 40, 50, 60, 70, 80, 90, 100, 120, 150],
    thicknessSeriesIn: [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 6],
    installedCostFactor: 1,
    source:
      'Fit at or below ASTM C547-17 Table 1 Type II maxima at 100–800 °F mean (from memory); use range to 1200 °F (from memory).',
  },
  {
    id: 'calcium-silicate',
    name: 'Calcium silicate pipe section',
    standard: 'ASTM C533 Type I',
    conductivity: { a: 0.051902, b: 7.0789e-5, c: 7.1021e-8 },
    fitPoints: [
      [37.78, 0.0545],
      [93.33, 0.0595],
      [204.4, 0.069],
      [315.6, 0.0815],
      [426.7, 0.095],
    ],
    serviceMinC: 27,
    serviceMaxC: 649,
    use: 'hot',
    thicknessSeriesMm: [25, 30, 40, 50, 65, 75, 90, 100, 115, 130, 150],
    thicknessSeriesIn: [1, 1.5, 2, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6],
    installedCostFactor: 1.4,
    source:
      'Fit below ASTM C533-17 Table 1 Type I maxima 0.45/0.50/0.60 Btu·in/(h·ft²·°F) at 200/400/600 °F mean (from memory); use range 80–1200 °F (from memory).',
  },
  {
    id: 'cellular-glass',
    name: 'Cellular glass pipe section',
    standard: 'ASTM C552 Grade 6 Type II',
    conductivity: { a: 0.043601, b: 1.531e-4, c: 3.2465e-7 },
    fitPoints: [
      [-17.78, 0.0408],
      [23.89, 0.0478],
      [93.33, 0.0605],
      [204.4, 0.0885],
    ],
    serviceMinC: -268,
    serviceMaxC: 427,
    use: 'hot-and-cold',
    thicknessSeriesMm: [30, 40, 50, 60, 70, 80, 90, 100],
    thicknessSeriesIn: [1, 1.5, 2, 2.5, 3, 3.5, 4],
    installedCostFactor: 1.6,
    source:
      'Fit below the C552 Grade 6 Type II maxima of the NIA Insulation Materials Specification Chart (April 2024): 0.29/0.34/0.43/0.63 Btu·in/(h·ft²·°F) at 0/75/200/400 °F mean; use range −450 to 800 °F (from memory).',
  },
  {
    id: 'flexible-elastomeric',
    name: 'Flexible elastomeric foam tube',
    standard: 'ASTM C534 Grade 1 Type I',
    conductivity: { a: 0.037436, b: 7.1358e-5, c: 1.0413e-7 },
    fitPoints: [
      [-17.78, 0.0362],
      [23.89, 0.0392],
      [93.3, 0.045],
    ],
    serviceMinC: -40,
    serviceMaxC: 104,
    use: 'cold',
    thicknessSeriesMm: [9, 13, 19, 25, 32, 40, 50],
    thicknessSeriesIn: [0.375, 0.5, 0.75, 1, 1.5, 2],
    installedCostFactor: 1.1,
    source:
      'Fit below the C534 Grade 1 maxima of the NIA Insulation Materials Specification Chart (April 2024): 0.26/0.28 Btu·in/(h·ft²·°F) at 0/75 °F mean; upper use 220 °F (from memory), lower −40 °C (common practice).',
  },
  {
    id: 'polyisocyanurate',
    name: 'Polyisocyanurate pipe section',
    standard: 'ASTM C591 Grade 2',
    conductivity: { a: 0.025508, b: 7.9403e-5, c: 1.0426e-6 },
    fitPoints: [
      [-40, 0.024],
      [23.89, 0.028],
      [93.33, 0.042],
    ],
    serviceMinC: -183,
    serviceMaxC: 149,
    use: 'cold',
    thicknessSeriesMm: [20, 25, 30, 40, 50, 60, 70, 80, 100],
    thicknessSeriesIn: [0.5, 1, 1.5, 2, 2.5, 3, 3.5, 4],
    installedCostFactor: 1.2,
    source:
      'Fit below the C591 Grade 2 maxima of the NIA Insulation Materials Specification Chart (April 2024): 0.22/0.30 Btu·in/(h·ft²·°F) at 75/200 °F mean; use range −297 to 300 °F (from memory).',
  },
] as const satisfies readonly InsulationMaterial[];

/** Identifier of a catalog insulation material. */
export type InsulationMaterialId = (typeof INSULATION_MATERIALS)[number]['id'];

/** Material identifiers, for schemas and drop-downs. */
export const INSULATION_MATERIAL_IDS = INSULATION_MATERIALS.map((m) => m.id) as [
  InsulationMaterialId,
  ...InsulationMaterialId[],
];
