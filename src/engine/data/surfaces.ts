/**
 * Total hemispherical emittance of bare pipe and jacket surfaces, as design values, grouped
 * by what a person sees on the pipe.
 *
 * Jacket values (all-service jacket, PVC, painted metal/mastic 0.9; aluminum new 0.1;
 * stainless jacket 0.3; galvanized new 0.1) are the typical values used with ASTM C680
 * practice (ASTM C1729 aluminum jacket, C1767 stainless jacket) — from memory. Aluminum
 * jacket dulled by weather 0.2 — from memory.
 *
 * Bare finishes: rust or mill scale on steel 0.8 (Incropera Table A.11 lists oxidized steel
 * near 0.79 — from memory); paint of any color 0.9 (painted metal, as for jackets — from
 * memory); dark tarnished copper 0.6 — from memory; dull metal (mill-finish stainless,
 * weathered galvanizing) 0.3 — from memory; bright metal (new copper, polished stainless,
 * new galvanizing) 0.1 — from memory (a bright ¾-in copper line at 60 °C: about 31.6 W/m at
 * ε 0.6, 21.9 W/m at ε 0.1, so the finish matters). Elastomeric foam skin 0.9 — common
 * practice.
 *
 * The `bare-*` ids are the older per-material names, kept so stored runs still parse.
 */
export type SurfaceLook =
  | 'rust-or-scale'
  | 'paint'
  | 'dark-tarnish'
  | 'dull-metal'
  | 'bright-metal'
  | 'plastic-or-fabric'
  | 'foam';

export const SURFACES = [
  { id: 'rust-or-scale', name: 'Rusty or scaled steel', emittance: 0.8, kind: 'bare', look: 'rust-or-scale' },
  { id: 'painted', name: 'Painted, any color', emittance: 0.9, kind: 'bare', look: 'paint' },
  { id: 'dark-tarnish', name: 'Dark, tarnished copper or brass', emittance: 0.6, kind: 'bare', look: 'dark-tarnish' },
  { id: 'dull-metal', name: 'Dull gray metal (mill-finish stainless, weathered galvanizing)', emittance: 0.3, kind: 'bare', look: 'dull-metal' },
  { id: 'bright-metal', name: 'Shiny metal (new copper, polished stainless, new galvanizing)', emittance: 0.1, kind: 'bare', look: 'bright-metal' },
  { id: 'bare-carbon-steel', name: 'Bare carbon steel, oxidized', emittance: 0.8, kind: 'bare', look: 'rust-or-scale' },
  { id: 'bare-stainless-steel', name: 'Bare stainless steel', emittance: 0.3, kind: 'bare', look: 'dull-metal' },
  { id: 'bare-copper', name: 'Bare copper, tarnished', emittance: 0.6, kind: 'bare', look: 'dark-tarnish' },
  { id: 'painted-metal', name: 'Painted metal or mastic', emittance: 0.9, kind: 'jacket', look: 'paint' },
  { id: 'all-service-jacket', name: 'White paper-faced jacket', emittance: 0.9, kind: 'jacket', look: 'plastic-or-fabric' },
  { id: 'pvc-jacket', name: 'PVC jacket', emittance: 0.9, kind: 'jacket', look: 'plastic-or-fabric' },
  { id: 'aluminium-jacket', name: 'Aluminum jacket, shiny', emittance: 0.1, kind: 'jacket', look: 'bright-metal' },
  { id: 'aluminium-jacket-dull', name: 'Aluminum jacket, dulled by weather', emittance: 0.2, kind: 'jacket', look: 'dull-metal' },
  { id: 'stainless-steel-jacket', name: 'Stainless steel jacket', emittance: 0.3, kind: 'jacket', look: 'dull-metal' },
  { id: 'galvanised-steel-jacket', name: 'Galvanized steel jacket, new', emittance: 0.1, kind: 'jacket', look: 'bright-metal' },
  { id: 'elastomeric-skin', name: 'Rubber-like foam, no jacket', emittance: 0.9, kind: 'jacket', look: 'foam' },
] as const satisfies readonly { id: string; name: string; emittance: number; kind: 'bare' | 'jacket'; look: SurfaceLook }[];

export type SurfaceId = (typeof SURFACES)[number]['id'];
export const SURFACE_IDS = SURFACES.map((s) => s.id) as [SurfaceId, ...SurfaceId[]];
export const JACKET_IDS = SURFACES.filter((s) => s.kind === 'jacket').map((s) => s.id) as [SurfaceId, ...SurfaceId[]];
/** Finishes of bare pipe a person can pick, by what they see (the older per-material ids excluded). */
export const BARE_FINISH_IDS = ['rust-or-scale', 'painted', 'dark-tarnish', 'dull-metal', 'bright-metal'] as const satisfies readonly SurfaceId[];
export type BareFinishId = (typeof BARE_FINISH_IDS)[number];
