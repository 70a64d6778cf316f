/**
 * Fuels: heating values (higher / gross basis throughout) and CO₂ emission factors.
 *
 * - US EPA: 40 CFR Part 98 Subpart C, Table C-1 "Default CO2 emission factors and
 *   high heat values" (as amended 81 FR 89188, Dec 2016); the same values appear in
 *   the US EPA GHG Emission Factors Hub (2024), Table 1. Natural gas 1.026
 *   MMBtu/Mscf and 53.06 kg CO₂/MMBtu; propane 0.091 MMBtu/gal and 62.87; No. 2
 *   distillate 0.138 MMBtu/gal and 73.96. Grid electricity: eGRID2022 US average
 *   total output rate, about 823 lb CO₂/MWh = 0.3733 kg/kWh — from memory.
 * - UK DESNZ "Greenhouse gas reporting: conversion factors 2023", condensed set,
 *   per kWh gross CV, kg CO₂e: natural gas 0.18293; LPG 0.21450; gas oil 0.25679;
 *   grid electricity (generation) 0.20707 — all from memory, check the edition.
 * - IPCC 2006 Guidelines, Vol. 2 ch. 2 Table 2.2 (net calorific value basis):
 *   natural gas 56.1, LPG 63.1, gas/diesel oil 74.1 kg CO₂/GJ — from memory;
 *   put on a gross basis with the usual net/gross ratios 0.90 (gas), 0.92 (LPG),
 *   0.94 (gas oil) — common practice (IEA convention for gas; others typical).
 *
 * Propane liquid density 0.508 kg/L and gas-oil density 0.85 kg/L (about 15 °C) —
 * from memory, used only when a price is given per kilogram.
 */

const BTU_J = 1055.05585262;
const MMBTU_J = 1e6 * BTU_J;
const SCF_M3 = 0.028316846592;
const GALLON_M3 = 0.003785411784;

export type FuelPriceUnit = 'therm' | 'MMBtu' | 'GJ' | 'kWh' | 'm3' | 'gallon' | 'litre' | 'kg';
export type EmissionSourceId = 'us-epa-2024' | 'uk-desnz-2023' | 'ipcc-2006';

export interface EmissionFactor {
  readonly source: EmissionSourceId;
  readonly label: string;
  readonly year: number;
  /** kg CO₂ (CO₂e for DESNZ) per GJ of fuel energy, higher heating value basis. */
  readonly kgCo2PerGJ: number;
  readonly note: string;
}

export interface Fuel {
  readonly id: string;
  readonly name: string;
  /** Physical unit in which fuel quantity is reported. */
  readonly quantityUnit: 'm3' | 'litre' | 'kWh';
  /** Higher heating value per physical unit, J (per standard m³ at 60 °F, 1 atm for gas). */
  readonly heatingValueJPerQuantityUnit: number;
  /** Density of the liquid, kg per liter, for prices per kg (liquids only). */
  readonly densityKgPerLitre: number | null;
  readonly priceUnits: readonly FuelPriceUnit[];
  readonly defaultPriceUnit: FuelPriceUnit;
  readonly defaultBoilerEfficiency: number;
  readonly emissionFactors: readonly EmissionFactor[];
}

const perMMBtu = (kg: number) => (kg / MMBTU_J) * 1e9;
const perKWh = (kg: number) => (kg / 3.6e6) * 1e9;

export const FUELS = [
  {
    id: 'natural-gas',
    name: 'Natural gas',
    quantityUnit: 'm3',
    heatingValueJPerQuantityUnit: (1026 * BTU_J) / SCF_M3,
    densityKgPerLitre: null,
    priceUnits: ['therm', 'MMBtu', 'GJ', 'kWh', 'm3'],
    defaultPriceUnit: 'therm',
    defaultBoilerEfficiency: 0.8,
    emissionFactors: [
      { source: 'us-epa-2024', label: 'US EPA GHG Emission Factors Hub 2024 (40 CFR 98 Table C-1)', year: 2024, kgCo2PerGJ: perMMBtu(53.06), note: '53.06 kg CO₂/MMBtu, HHV' },
      { source: 'uk-desnz-2023', label: 'UK DESNZ conversion factors 2023', year: 2023, kgCo2PerGJ: perKWh(0.18293), note: '0.18293 kg CO₂e/kWh gross CV (from memory)' },
      { source: 'ipcc-2006', label: 'IPCC 2006 Guidelines, Vol. 2 Table 2.2', year: 2006, kgCo2PerGJ: 56.1 * 0.9, note: '56.1 kg CO₂/GJ NCV × 0.90 net/gross (from memory)' },
    ],
  },
  {
    id: 'propane',
    name: 'Propane (LPG)',
    quantityUnit: 'litre',
    heatingValueJPerQuantityUnit: (0.091 * MMBTU_J) / (GALLON_M3 * 1000),
    densityKgPerLitre: 0.508,
    priceUnits: ['gallon', 'litre', 'kg', 'MMBtu', 'GJ', 'kWh'],
    defaultPriceUnit: 'gallon',
    defaultBoilerEfficiency: 0.8,
    emissionFactors: [
      { source: 'us-epa-2024', label: 'US EPA GHG Emission Factors Hub 2024 (40 CFR 98 Table C-1)', year: 2024, kgCo2PerGJ: perMMBtu(62.87), note: '62.87 kg CO₂/MMBtu, HHV' },
      { source: 'uk-desnz-2023', label: 'UK DESNZ conversion factors 2023', year: 2023, kgCo2PerGJ: perKWh(0.2145), note: '0.21450 kg CO₂e/kWh gross CV, LPG (from memory)' },
      { source: 'ipcc-2006', label: 'IPCC 2006 Guidelines, Vol. 2 Table 2.2', year: 2006, kgCo2PerGJ: 63.1 * 0.92, note: '63.1 kg CO₂/GJ NCV × 0.92 net/gross (from memory)' },
    ],
  },
  {
    id: 'fuel-oil-2',
    name: 'Heating oil / gas oil (No. 2 distillate)',
    quantityUnit: 'litre',
    heatingValueJPerQuantityUnit: (0.138 * MMBTU_J) / (GALLON_M3 * 1000),
    densityKgPerLitre: 0.85,
    priceUnits: ['gallon', 'litre', 'kg', 'MMBtu', 'GJ', 'kWh'],
    defaultPriceUnit: 'gallon',
    defaultBoilerEfficiency: 0.8,
    emissionFactors: [
      { source: 'us-epa-2024', label: 'US EPA GHG Emission Factors Hub 2024 (40 CFR 98 Table C-1)', year: 2024, kgCo2PerGJ: perMMBtu(73.96), note: '73.96 kg CO₂/MMBtu, HHV' },
      { source: 'uk-desnz-2023', label: 'UK DESNZ conversion factors 2023', year: 2023, kgCo2PerGJ: perKWh(0.25679), note: '0.25679 kg CO₂e/kWh gross CV, gas oil (from memory)' },
      { source: 'ipcc-2006', label: 'IPCC 2006 Guidelines, Vol. 2 Table 2.2', year: 2006, kgCo2PerGJ: 74.1 * 0.94, note: '74.1 kg CO₂/GJ NCV × 0.94 net/gross (from memory)' },
    ],
  },
  {
    id: 'electricity',
    name: 'Electricity (electric boiler)',
    quantityUnit: 'kWh',
    heatingValueJPerQuantityUnit: 3.6e6,
    densityKgPerLitre: null,
    priceUnits: ['kWh'],
    defaultPriceUnit: 'kWh',
    defaultBoilerEfficiency: 0.99,
    emissionFactors: [
      { source: 'us-epa-2024', label: 'US EPA eGRID2022, US average total output rate', year: 2022, kgCo2PerGJ: perKWh(0.3733), note: '≈823 lb CO₂/MWh (from memory)' },
      { source: 'uk-desnz-2023', label: 'UK DESNZ conversion factors 2023, UK electricity', year: 2023, kgCo2PerGJ: perKWh(0.20707), note: '0.20707 kg CO₂e/kWh (from memory)' },
    ],
  },
] as const satisfies readonly Fuel[];

export type FuelId = (typeof FUELS)[number]['id'];
export const FUEL_IDS = FUELS.map((f) => f.id) as [FuelId, ...FuelId[]];
export const EMISSION_SOURCE_IDS = ['us-epa-2024', 'uk-desnz-2023', 'ipcc-2006'] as const satisfies readonly EmissionSourceId[];
export const FUEL_PRICE_UNITS = ['therm', 'MMBtu', 'GJ', 'kWh', 'm3', 'gallon', 'litre', 'kg'] as const satisfies readonly FuelPriceUnit[];
