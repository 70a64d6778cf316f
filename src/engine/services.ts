import type { LiquidKind } from './inside-film';
import type { InsulationMaterialId } from './data/insulation-materials';
import type { SurfaceId } from './data/surfaces';

/** Services the estimate form offers for a pipe run. */
export type ServiceId =
  | 'steam'
  | 'condensate-return'
  | 'hot-water'
  | 'cip-supply'
  | 'cip-return'
  | 'chilled-water'
  | 'glycol';

/** Defaults the form and the engine share for one service. */
export interface ServiceDefaults {
  readonly id: ServiceId;
  readonly name: string;
  readonly kind: 'steam' | 'liquid';
  /** Typical line gauge pressure for steam, kPa(g); null for liquids. */
  readonly typicalGaugePressureKPa: number | null;
  /** Typical fluid temperature, °C (for steam: saturation at the typical pressure, rounded). */
  readonly typicalTemperatureC: number;
  readonly liquid: LiquidKind | null;
  /** Typical velocity in the line, m/s (drives the liquid inside film). */
  readonly typicalVelocityMPerS: number;
  /** Inside film used when none is computed (steam), W/(m²·K); null where computed from velocity. */
  readonly insideFilmWPerM2K: number | null;
  /** Whether the line runs below room air (heat gain, condensation control). */
  readonly cold: boolean;
  readonly defaultInsulation: InsulationMaterialId;
  readonly defaultJacket: SurfaceId;
}

/**
 * Per-service defaults — common practice for small food plants (values are ours,
 * typical of the trade, not from a standard): low-pressure process steam at
 * 700 kPa(g) (≈100 psig); condensate at 90 °C; hot water at 70 °C; CIP caustic
 * wash supplied at 80 °C and returned at 70 °C at 1.5 m/s (the usual minimum for
 * turbulent cleaning flow); chilled water at 6 °C; 30 % propylene glycol at −5 °C.
 * Liquid mains at 1 m/s. Condensing steam film 10 000 W/(m²·K) (see inside-film.ts).
 * PVC jacket by default: cleanable, as food zones need.
 */
export const SERVICE_DEFAULTS: readonly ServiceDefaults[] = [
  { id: 'steam', name: 'Steam', kind: 'steam', typicalGaugePressureKPa: 700, typicalTemperatureC: 170, liquid: null, typicalVelocityMPerS: 25, insideFilmWPerM2K: 10000, cold: false, defaultInsulation: 'mineral-wool', defaultJacket: 'pvc-jacket' },
  { id: 'condensate-return', name: 'Condensate return', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: 90, liquid: 'water', typicalVelocityMPerS: 1, insideFilmWPerM2K: null, cold: false, defaultInsulation: 'mineral-wool', defaultJacket: 'pvc-jacket' },
  { id: 'hot-water', name: 'Hot water', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: 70, liquid: 'water', typicalVelocityMPerS: 1, insideFilmWPerM2K: null, cold: false, defaultInsulation: 'glass-fibre', defaultJacket: 'pvc-jacket' },
  { id: 'cip-supply', name: 'Clean-in-place supply', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: 80, liquid: 'water', typicalVelocityMPerS: 1.5, insideFilmWPerM2K: null, cold: false, defaultInsulation: 'glass-fibre', defaultJacket: 'pvc-jacket' },
  { id: 'cip-return', name: 'Clean-in-place return', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: 70, liquid: 'water', typicalVelocityMPerS: 1.5, insideFilmWPerM2K: null, cold: false, defaultInsulation: 'glass-fibre', defaultJacket: 'pvc-jacket' },
  { id: 'chilled-water', name: 'Chilled water', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: 6, liquid: 'water', typicalVelocityMPerS: 1, insideFilmWPerM2K: null, cold: true, defaultInsulation: 'flexible-elastomeric', defaultJacket: 'pvc-jacket' },
  { id: 'glycol', name: 'Glycol (30 % propylene glycol)', kind: 'liquid', typicalGaugePressureKPa: null, typicalTemperatureC: -5, liquid: 'propylene-glycol-30', typicalVelocityMPerS: 1, insideFilmWPerM2K: null, cold: true, defaultInsulation: 'flexible-elastomeric', defaultJacket: 'pvc-jacket' },
];

export const SERVICE_IDS = SERVICE_DEFAULTS.map((s) => s.id) as [ServiceId, ...ServiceId[]];

/** Defaults of one service. */
export function serviceDefaults(id: ServiceId): ServiceDefaults {
  const found = SERVICE_DEFAULTS.find((s) => s.id === id);
  if (!found) throw new RangeError(`Unknown service ${id}`);
  return found;
}
