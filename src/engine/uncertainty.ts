/** How well an input is known; sets the spread of its low–high range. */
export type Confidence = 'measured' | 'estimated' | 'guessed';

/**
 * Relative half-width of the range for each confidence — common practice (our own
 * choice for self-assessment inputs): measured ±5 %, estimated ±20 %, guessed ±50 %.
 */
export const CONFIDENCE_SPREADS: Readonly<Record<Confidence, number>> = {
  measured: 0.05,
  estimated: 0.2,
  guessed: 0.5,
};

/**
 * Seeded pseudo-random numbers in [0, 1): mulberry32 (Tommy Ettinger, public domain), small
 * and fast, so a range is reproducible from its seed. One stream for the engine, reseeded by
 * each range ({@link seedDraws}; the engine is synchronous, so one range draws at a time). It
 * lives in a module-level typed array rather than a closure or an object of its own: a uint32
 * in a closure variable is boxed on every draw, and the sampling loop's optimized code would be
 * thrown away whenever a collection cleared the shape of a short-lived generator object.
 */
const drawState = new Uint32Array(1);

/** Starts the stream of {@link nextDraw} at a seed. */
export function seedDraws(seed: number): void {
  drawState[0] = seed;
}

/** The next number of the stream, in [0, 1). */
export function nextDraw(): number {
  drawState[0] = (drawState[0] as number) + 0x6d2b79f5;
  let t = drawState[0] as number;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}

/** A symmetric triangular multiplier on [1 − s, 1 + s] with mode 1, from a uniform u. */
export function triangularFactor(spread: number, u: number): number {
  return 1 + spread * triangularOffset(u);
}

/** The offset of a triangular multiplier from its mode, on [−1, 1], from a uniform u: the factor is 1 + spread × offset. */
export function triangularOffset(u: number): number {
  // One square root either side of the mode, chosen by value rather than by branch: u is as
  // likely below ½ as above, so a branch would be mispredicted half the time.
  const low = u < 0.5;
  const root = Math.sqrt(low ? 2 * u : 2 * (1 - u));
  return low ? root - 1 : 1 - root;
}

/**
 * The triangular offsets of the stream's next `count` draws, in order, written into `out` — the
 * same numbers as `count` calls of {@link triangularOffset}({@link nextDraw}()), in one tight
 * loop that keeps the stream's state in a register.
 */
export function fillTriangularOffsets(out: Float64Array, count: number): void {
  let state = (drawState[0] as number) | 0;
  for (let k = 0; k < count; k++) {
    state = (state + 0x6d2b79f5) | 0;
    let t = Math.imul(state ^ (state >>> 15), state | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    out[k] = triangularOffset(((t ^ (t >>> 14)) >>> 0) / 4294967296);
  }
  drawState[0] = state;
}

/** Value at quantile p (0–1) of a sorted array, linear between order statistics. */
export function quantileSorted(sorted: Float64Array, p: number): number {
  const n = sorted.length;
  if (n === 0) return Number.NaN;
  const position = p * (n - 1);
  const lower = Math.floor(position);
  const upper = Math.min(n - 1, lower + 1);
  const w = position - lower;
  return (sorted[lower] as number) * (1 - w) + (sorted[upper] as number) * w;
}
