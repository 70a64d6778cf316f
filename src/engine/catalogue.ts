import { INSULATION_MATERIALS, type InsulationMaterial } from './data/insulation-materials';
import { PIPE_MATERIALS } from './data/pipe-materials';
import { PIPE_STANDARDS, type PipeSizeEntry, type PipeStandard } from './data/pipe-dimensions';
import { SURFACES } from './data/surfaces';
import { FUELS, type Fuel } from './data/fuels';
import { EngineError } from './errors';

/** Outside diameter and wall of a catalog pipe. */
export interface PipeDimensions {
  readonly standard: string;
  readonly size: string;
  readonly schedule: string;
  readonly outerDiameterM: number;
  readonly wallThicknessM: number;
  readonly nominalInch: number;
  readonly dn: number;
}

/** Looks up a pipe standard by id, or undefined. */
export function findPipeStandard(standard: string): PipeStandard | undefined {
  return PIPE_STANDARDS.find((s) => s.id === standard);
}

/** Parses "1-1/2", "1 1/2", "3/4", "1.5" or "2" into inches; NaN when it is none of these. */
function parseInchSize(text: string): number {
  const t = text.trim().replace(/["”]|\s*in(ch(es)?)?$/i, '').trim();
  const mixed = /^(\d+)[\s-]+(\d+)\/(\d+)$/.exec(t);
  if (mixed) return Number(mixed[1]) + Number(mixed[2]) / Number(mixed[3]);
  const fraction = /^(\d+)\/(\d+)$/.exec(t);
  if (fraction) return Number(fraction[1]) / Number(fraction[2]);
  if (/^\d+(\.\d+)?$/.test(t)) return Number(t);
  return Number.NaN;
}

/** Finds a size entry of a standard, accepting NPS fractions, decimals or "DN50". */
export function findPipeSize(standard: PipeStandard, size: string): PipeSizeEntry | undefined {
  const text = size.trim();
  const dn = /^DN\s*(\d+)$/i.exec(text);
  if (dn) return standard.sizes.find((s) => s.dn === Number(dn[1]));
  if (standard.id === 'EN-10220' && /^\d+$/.test(text)) return standard.sizes.find((s) => s.dn === Number(text));
  const exact = standard.sizes.find((s) => s.size === text);
  if (exact) return exact;
  const inches = parseInchSize(text);
  if (!Number.isFinite(inches)) return undefined;
  return standard.sizes.find((s) => Math.abs(s.nominalInch - inches) < 1e-9);
}

/** Normalizes "Sch 40", "sch40s", "2.90" to the catalog's schedule keys. */
function normaliseSchedule(entry: PipeSizeEntry, schedule: string): string | undefined {
  // The catalog's own spelling (what the form sends) needs no clean-up: every key is already in the form below.
  if (Object.hasOwn(entry.wallsM, schedule)) return schedule;
  const t = schedule
    .trim()
    .toUpperCase()
    .replace(/^SCH(EDULE)?\.?\s*/, '')
    .replace(/^TYPE\s*/, '');
  if (t in entry.wallsM) return t;
  const asNumber = Number(t.replace(/\s*MM$/, ''));
  if (Number.isFinite(asNumber)) {
    const key = asNumber.toFixed(1);
    if (key in entry.wallsM) return key;
  }
  return undefined;
}

/**
 * Dimensions of a catalog pipe.
 *
 * @throws EngineError UNKNOWN_PIPE_SIZE or UNKNOWN_SCHEDULE with a sentence naming what exists
 */
export function lookupPipe(standardId: string, size: string, schedule?: string): PipeDimensions {
  const standard = findPipeStandard(standardId);
  if (!standard) {
    throw new EngineError(
      'UNKNOWN_PIPE_SIZE',
      `Unknown pipe standard "${standardId}"; choose one of ${PIPE_STANDARDS.map((s) => s.id).join(', ')}.`,
    );
  }
  const entry = findPipeSize(standard, size);
  if (!entry) {
    throw new EngineError(
      'UNKNOWN_PIPE_SIZE',
      `${standard.name} has no size "${size}"; sizes run from ${standard.sizes[0]?.size} to ${standard.sizes[standard.sizes.length - 1]?.size}.`,
    );
  }
  const key = schedule === undefined ? entry.defaultSchedule : normaliseSchedule(entry, schedule);
  const wall = key === undefined ? undefined : entry.wallsM[key];
  if (key === undefined || wall === undefined) {
    throw new EngineError(
      'UNKNOWN_SCHEDULE',
      `${standard.name} size ${entry.size} has no schedule or wall "${schedule}"; it offers ${Object.keys(entry.wallsM).join(', ')}.`,
    );
  }
  return {
    standard: standard.id,
    size: entry.size,
    schedule: key,
    outerDiameterM: entry.outerDiameterM,
    wallThicknessM: wall,
    nominalInch: entry.nominalInch,
    dn: entry.dn,
  };
}

/** Catalog insulation material by id, or undefined. */
export function findInsulationMaterial(id: string): InsulationMaterial | undefined {
  return (INSULATION_MATERIALS as readonly InsulationMaterial[]).find((m) => m.id === id);
}

/** Catalog pipe material by id, or undefined. */
export function findPipeMaterial(id: string): (typeof PIPE_MATERIALS)[number] | undefined {
  return PIPE_MATERIALS.find((m) => m.id === id);
}

/** Catalog surface (bare or jacket) by id, or undefined. */
export function findSurface(id: string): (typeof SURFACES)[number] | undefined {
  return SURFACES.find((s) => s.id === id);
}

/** Catalog fuel by id, or undefined. */
export function findFuel(id: string): Fuel | undefined {
  return (FUELS as readonly Fuel[]).find((f) => f.id === id);
}
