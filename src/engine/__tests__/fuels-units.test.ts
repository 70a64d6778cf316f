import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  FUELS,
  UNIT_FACTORS,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  fromSI,
  fuelCostPerJoule,
  toSI,
  type Fuel,
  type FuelId,
  type Quantity,
} from '../index';
import { expectWithin, type ReferenceRow } from './reference-rows';

const fuel = (id: FuelId): Fuel => FUELS.find((f) => f.id === id) as Fuel;
const factor = (id: FuelId, source: string) => fuel(id).emissionFactors.find((f) => f.source === source)?.kgCo2PerGJ ?? Number.NaN;
const hhvPerM3 = (id: FuelId) => fuel(id).heatingValueJPerQuantityUnit * (fuel(id).quantityUnit === 'litre' ? 1000 : 1);

const EPA = '40 CFR Part 98 Subpart C Table C-1 / US EPA GHG Emission Factors Hub 2024 (references.md §9, read-here)';
const rows: ReferenceRow<null>[] = [
  { name: 'T9-NG-HHV', input: null, expected: 3.82277e7, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-NG-CO2', input: null, expected: 50.2912, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-NG-CO2-scf', input: null, expected: 1.92253, tolerance: { relative: 0.002 }, source: EPA },
  { name: 'T9-NO2-HHV', input: null, expected: 3.84628e10, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-NO2-CO2', input: null, expected: 70.1006, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-PROPANE-HHV', input: null, expected: 2.53632e10, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-PROPANE-CO2', input: null, expected: 59.5893, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-NO2-CO2-gal', input: null, expected: 2696.27, tolerance: { relative: 0.002 }, source: EPA },
  { name: 'T9-PROPANE-CO2-gal', input: null, expected: 1511.37, tolerance: { relative: 0.002 }, source: EPA },
  { name: 'T9-NG-therm', input: null, expected: 5.306, tolerance: { relative: 0.001 }, source: 'US EIA Voluntary Reporting (1605) Table 1 (read-here)' },
  // The row prints 1.05506e+08 but states the definition, 105.505585 MJ; the definition is the check value.
  { name: 'T9-UNIT-therm', input: null, expected: 1.05505585e8, tolerance: { relative: 0.000001 }, source: 'Definition, 100 000 Btu_IT = 105.505585 MJ (NIST SP 811) — from memory' },
  { name: 'T9-UNIT-MMBtu-kWh', input: null, expected: 293.071, tolerance: { relative: 0.0001 }, source: 'Carbon Trust conversion factors (read-here)' },
  { name: 'T9-NG-kgCO2-per-kWhHHV', input: null, expected: 0.181048, tolerance: { relative: 0.001 }, source: EPA },
  { name: 'T9-IPCC-NG', input: null, expected: 56.1, tolerance: { relative: 0.005 }, source: 'IPCC 2006 Vol. 2 Table 2.2, NCV — from memory' },
  { name: 'T9-IPCC-gasoil', input: null, expected: 74.1, tolerance: { relative: 0.005 }, source: 'IPCC 2006 Vol. 2 Table 2.2, NCV — from memory' },
  { name: 'T9-IPCC-LPG', input: null, expected: 63.1, tolerance: { relative: 0.005 }, source: 'IPCC 2006 Vol. 2 Table 2.2, NCV — from memory' },
  { name: 'T9-UK-NG-2023', input: null, expected: 0.18293, tolerance: { relative: 0.01 }, source: 'UK DESNZ conversion factors 2023 — from memory' },
];

const actual: Record<string, () => number> = {
  'T9-NG-HHV': () => hhvPerM3('natural-gas'),
  'T9-NG-CO2': () => factor('natural-gas', 'us-epa-2024'),
  'T9-NG-CO2-scf': () => (factor('natural-gas', 'us-epa-2024') * hhvPerM3('natural-gas')) / 1e9,
  'T9-NO2-HHV': () => hhvPerM3('fuel-oil-2'),
  'T9-NO2-CO2': () => factor('fuel-oil-2', 'us-epa-2024'),
  'T9-PROPANE-HHV': () => hhvPerM3('propane'),
  'T9-PROPANE-CO2': () => factor('propane', 'us-epa-2024'),
  'T9-NO2-CO2-gal': () => (factor('fuel-oil-2', 'us-epa-2024') * hhvPerM3('fuel-oil-2')) / 1e9,
  'T9-PROPANE-CO2-gal': () => (factor('propane', 'us-epa-2024') * hhvPerM3('propane')) / 1e9,
  'T9-NG-therm': () => (factor('natural-gas', 'us-epa-2024') * UNIT_FACTORS.energy.therm) / 1e9,
  'T9-UNIT-therm': () => toSI('energy', 1, 'therm'),
  'T9-UNIT-MMBtu-kWh': () => fromSI('energy', toSI('energy', 1, 'MMBtu'), 'kWh'),
  'T9-NG-kgCO2-per-kWhHHV': () => (factor('natural-gas', 'us-epa-2024') * 3.6e6) / 1e9,
  // The catalog holds IPCC factors on a gross basis (× net/gross); undo it to compare.
  'T9-IPCC-NG': () => factor('natural-gas', 'ipcc-2006') / 0.9,
  'T9-IPCC-gasoil': () => factor('fuel-oil-2', 'ipcc-2006') / 0.94,
  'T9-IPCC-LPG': () => factor('propane', 'ipcc-2006') / 0.92,
  'T9-UK-NG-2023': () => (factor('natural-gas', 'uk-desnz-2023') * 3.6e6) / 1e9,
};

describe('fuels and emission factors', () => {
  it.each(rows)('$name', (row) => expectWithin((actual[row.name] as () => number)(), row));

  it('prices in any offered unit give the same cost per joule when they describe the same fuel', () => {
    const gas = fuel('natural-gas');
    const perTherm = fuelCostPerJoule(gas, 1, 'therm');
    expect(fuelCostPerJoule(gas, 10, 'MMBtu')).toBeCloseTo(perTherm, 15);
    const perM3 = 1 * (gas.heatingValueJPerQuantityUnit / UNIT_FACTORS.energy.therm);
    expect(fuelCostPerJoule(gas, perM3, 'm3') / perTherm).toBeCloseTo(1, 12);
    const propane = fuel('propane');
    expect(fuelCostPerJoule(propane, 3.785411784, 'gallon') / fuelCostPerJoule(propane, 1, 'litre')).toBeCloseTo(1, 12);
    expect(() => fuelCostPerJoule(gas, 1, 'gallon')).toThrow(/cannot be priced per gallon/);
  });
});

describe('unit conversions (NIST SP 811)', () => {
  it('matches the SP 811 factors to their printed seven digits', () => {
    const close = (a: number, b: number) => expect(Math.abs(a / b - 1)).toBeLessThan(5e-7);
    close(toSI('pressure', 1, 'psi') * 1000, 6.894757e3);
    close(toSI('power', 1, 'Btu/h'), 2.930711e-1);
    close(toSI('conductivity', 1, 'Btu·in/(h·ft2·°F)'), 1.442279e-1);
    close(toSI('heatTransferCoefficient', 1, 'Btu/(h·ft2·°F)'), 5.678263);
    close(toSI('volume', 1, 'gal'), 3.785412e-3);
    close(toSI('energy', 1, 'Btu'), 1.055056e3);
    close(toSI('massFlow', 1, 'lb/h') / 3600, 1.259979e-4);
    // Btu/(h·ft) is not listed in SP 811; it is its Btu_IT/h over the international foot.
    close(toSI('heatFlowPerLength', 1, 'Btu/(h·ft)'), 2.930711e-1 / 0.3048);
    expect(toSI('speed', 1, 'mph')).toBe(0.44704);
    expect(fahrenheitToCelsius(212)).toBeCloseTo(100, 12);
    expect(fahrenheitToCelsius(-40)).toBeCloseTo(-40, 12);
  });

  it('every conversion round-trips', () => {
    const pairs = Object.entries(UNIT_FACTORS).flatMap(([q, units]) => Object.keys(units).map((u) => [q, u] as const));
    fc.assert(
      fc.property(fc.constantFrom(...pairs), fc.double({ min: -1e9, max: 1e9, noNaN: true }), ([q, u], x) => {
        const back = fromSI(q as Quantity, toSI(q as Quantity, x, u as never), u as never);
        expect(Math.abs(back - x)).toBeLessThanOrEqual(1e-12 * Math.max(1, Math.abs(x)));
        expect(Math.abs(celsiusToFahrenheit(fahrenheitToCelsius(x)) - x)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(x)));
      }),
      { numRuns: 300, seed: 11 },
    );
  });
});
