/**
 * Total hemispherical emittance of bare pipe and jacket surfaces, as design values.
 *
 * Jacket values (all-service jacket, PVC, painted metal/mastic 0.9; aluminium new
 * 0.1; stainless jacket 0.3; galvanised new 0.1) are the typical values used with
 * ASTM C680 practice (ASTM C1729 aluminium jacket, C1767 stainless jacket) — from
 * memory. Bare pipe: oxidised carbon steel 0.8 (Incropera Table A.11 lists
 * oxidised steel near 0.79 — from memory), stainless as supplied 0.3 and tarnished
 * copper 0.6 — from memory. Elastomeric foam skin 0.9 — common practice.
 */
export const SURFACES = [
  { id: 'bare-carbon-steel', name: 'Bare carbon steel, oxidised', emittance: 0.8, kind: 'bare' },
  { id: 'bare-stainless-steel', name: 'Bare stainless steel', emittance: 0.3, kind: 'bare' },
  { id: 'bare-copper', name: 'Bare copper, tarnished', emittance: 0.6, kind: 'bare' },
  { id: 'painted-metal', name: 'Painted metal or mastic', emittance: 0.9, kind: 'jacket' },
  { id: 'all-service-jacket', name: 'All-service jacket (white kraft)', emittance: 0.9, kind: 'jacket' },
  { id: 'pvc-jacket', name: 'PVC jacket', emittance: 0.9, kind: 'jacket' },
  { id: 'aluminium-jacket', name: 'Aluminium jacket, new', emittance: 0.1, kind: 'jacket' },
  { id: 'stainless-steel-jacket', name: 'Stainless steel jacket', emittance: 0.3, kind: 'jacket' },
  { id: 'galvanised-steel-jacket', name: 'Galvanised steel jacket, new', emittance: 0.1, kind: 'jacket' },
  { id: 'elastomeric-skin', name: 'Elastomeric foam, unjacketed', emittance: 0.9, kind: 'jacket' },
] as const satisfies readonly { id: string; name: string; emittance: number; kind: 'bare' | 'jacket' }[];

export type SurfaceId = (typeof SURFACES)[number]['id'];
export const SURFACE_IDS = SURFACES.map((s) => s.id) as [SurfaceId, ...SurfaceId[]];
export const JACKET_IDS = SURFACES.filter((s) => s.kind === 'jacket').map((s) => s.id) as [SurfaceId, ...SurfaceId[]];
