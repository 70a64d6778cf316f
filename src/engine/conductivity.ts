/**
 * Temperature-dependent thermal conductivity as a polynomial k(T) = a + bT + cT²
 * (T in °C), with its integral in closed form. The mean conductivity of a layer is
 * k̄ = ∫k dT / ΔT over the layer's own span — the ASTM C680 approach, exact for a
 * cylinder with k(T) — so a layer is handled through its conductivity integral
 * K(T) = aT + bT²/2 + cT³/3 without any numerical quadrature.
 */
export interface ConductivityCurve {
  /** W/(m·K) */
  readonly a: number;
  /** W/(m·K²) */
  readonly b: number;
  /** W/(m·K³) */
  readonly c: number;
}

/** A constant conductivity as a curve. */
export function constantConductivity(conductivityWPerMK: number): ConductivityCurve {
  return { a: conductivityWPerMK, b: 0, c: 0 };
}

/** k(T), W/(m·K). */
export function conductivityAt(curve: ConductivityCurve, temperatureC: number): number {
  return curve.a + temperatureC * (curve.b + temperatureC * curve.c);
}

/** K(T) = ∫₀ᵀ k dT, W/m. */
export function conductivityIntegral(curve: ConductivityCurve, temperatureC: number): number {
  return temperatureC * (curve.a + temperatureC * (curve.b / 2 + (temperatureC * curve.c) / 3));
}

/** Mean conductivity over [t1, t2]: ∫k dT / (t2 − t1), or k at the point when they meet. */
export function meanConductivity(curve: ConductivityCurve, t1C: number, t2C: number): number {
  const span = t2C - t1C;
  if (Math.abs(span) < 1e-9) return conductivityAt(curve, 0.5 * (t1C + t2C));
  return (conductivityIntegral(curve, t2C) - conductivityIntegral(curve, t1C)) / span;
}

/**
 * Temperature T with K(T) − K(fromC) = deltaIntegral, i.e. the far face of a layer
 * whose near face is at `fromC` and through which ΔK = q′·ln(D₂/D₁)/(2π) flows.
 *
 * Beyond [lowC, highC] the integral is continued linearly with the conductivity at
 * the bound, so the answer stays finite, continuous and monotone for any heat flow
 * the root finder may try; inside the bounds it is exact (safeguarded Newton).
 */
export function temperatureAcrossLayer(
  curve: ConductivityCurve,
  fromTemperatureC: number,
  deltaIntegral: number,
  lowTemperatureC: number,
  highTemperatureC: number,
): number {
  // Unary plus makes each argument a plain double for the optimiser: a loop variable that starts
  // from an argument as passed stays boxed, and each step of the loop below would allocate.
  const fromC = +fromTemperatureC;
  const lowC = +lowTemperatureC;
  const highC = +highTemperatureC;
  if (curve.b === 0 && curve.c === 0) return fromC + deltaIntegral / curve.a;
  const start = conductivityIntegral(curve, fromC);
  const target = start + deltaIntegral;
  let lo = fromC;
  let hi = fromC;
  if (deltaIntegral >= 0) {
    const top = conductivityIntegral(curve, highC);
    if (target >= top) return highC + (target - top) / conductivityAt(curve, highC);
    lo = fromC;
    hi = highC;
  } else {
    const bottom = conductivityIntegral(curve, lowC);
    if (target <= bottom) return lowC + (target - bottom) / conductivityAt(curve, lowC);
    lo = lowC;
    hi = fromC;
  }
  let t = fromC + deltaIntegral / conductivityAt(curve, fromC + deltaIntegral / (2 * conductivityAt(curve, fromC)));
  if (!(t > lo && t < hi)) t = 0.5 * (lo + hi);
  for (let i = 0; i < 60; i++) {
    const f = conductivityIntegral(curve, t) - target;
    if (f > 0) hi = t;
    else lo = t;
    const step = f / conductivityAt(curve, t);
    let next = t - step;
    if (!(next > lo && next < hi)) next = 0.5 * (lo + hi);
    if (Math.abs(next - t) <= 1e-12 * (1 + Math.abs(t))) return next;
    t = next;
  }
  return t;
}
