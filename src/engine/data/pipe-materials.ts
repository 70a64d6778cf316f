/**
 * Pipe wall materials. Conductivity at typical service temperature (about
 * 100–200 °C) from Incropera et al., Fundamentals of Heat and Mass Transfer 6th
 * ed., Table A.1 (carbon steel AISI 1010: 58.7 W/(m·K) at 400 K, 48.8 at 600 K;
 * AISI 304: 16.6 at 400 K) and, for phosphorus-deoxidised copper tube (C12200),
 * a typical 339 W/(m·K) — all from memory. The wall is a small resistance beside
 * the surface film, so a constant k is enough.
 *
 * Bare-surface emittance (oxidized carbon steel 0.8, stainless as supplied 0.3,
 * tarnished copper 0.6): from memory, usual design values; see surfaces.ts.
 */
export const PIPE_MATERIALS = [
  { id: 'carbon-steel', name: 'Carbon steel', conductivityWPerMK: 52, bareSurface: 'bare-carbon-steel' },
  { id: 'stainless-steel', name: 'Stainless steel (304/316)', conductivityWPerMK: 16, bareSurface: 'bare-stainless-steel' },
  { id: 'copper', name: 'Copper tube', conductivityWPerMK: 339, bareSurface: 'bare-copper' },
] as const satisfies readonly {
  id: string;
  name: string;
  conductivityWPerMK: number;
  bareSurface: string;
}[];

export type PipeMaterialId = (typeof PIPE_MATERIALS)[number]['id'];
export const PIPE_MATERIAL_IDS = PIPE_MATERIALS.map((m) => m.id) as [PipeMaterialId, ...PipeMaterialId[]];
