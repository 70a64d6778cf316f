/**
 * ILLUSTRATIVE DEMO PRICES — invented for Lagwise's demonstration, not a quotation
 * and not market data. A consultant replaces this table with their own prices
 * (PlantInput.priceTable); every result states which table it used.
 *
 * Installed cost per meter of straight pipe (material, PVC jacket and labor) by
 * pipe outside diameter (rows) and insulation thickness (columns), in the plant's
 * currency, for a material with installedCostFactor 1 (mineral wool). Removable
 * covers for valves and flange pairs are priced per fitting by pipe OD.
 */
export interface InstalledCostTable {
  readonly label: string;
  readonly illustrative: boolean;
  readonly pipeOuterDiametersM: readonly number[];
  readonly thicknessesM: readonly number[];
  /** costPerMetre[row for OD][column for thickness] */
  readonly costPerMetre: readonly (readonly number[])[];
  readonly fittingCoverCostEach: readonly number[];
}

export const DEMO_INSTALLED_COST_TABLE: InstalledCostTable = {
  label: 'Lagwise illustrative demo prices (not a quotation)',
  illustrative: true,
  pipeOuterDiametersM: [0.0213, 0.0334, 0.0483, 0.0603, 0.0889, 0.1143, 0.1683, 0.2191, 0.273, 0.3238, 0.4064, 0.6096],
  thicknessesM: [0.0127, 0.0254, 0.0381, 0.0508, 0.0635, 0.0762, 0.1016, 0.1524],
  costPerMetre: [
    [31, 38, 47, 56, 66, 77, 101, 159],
    [33, 41, 50, 59, 70, 81, 106, 165],
    [36, 45, 54, 64, 75, 87, 112, 174],
    [39, 47, 57, 68, 79, 91, 118, 180],
    [45, 54, 65, 76, 88, 101, 130, 196],
    [50, 60, 72, 84, 97, 111, 141, 210],
    [61, 73, 86, 100, 115, 131, 164, 241],
    [72, 85, 100, 116, 132, 149, 186, 269],
    [83, 98, 115, 132, 150, 169, 209, 299],
    [93, 111, 129, 147, 167, 187, 231, 327],
    [110, 130, 151, 172, 195, 218, 266, 373],
    [153, 179, 206, 234, 263, 292, 354, 486],
  ],
  fittingCoverCostEach: [139, 150, 163, 174, 200, 223, 271, 317, 366, 411, 486, 669],
};
