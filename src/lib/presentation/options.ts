/**
 * A run's choices side by side — leave as it is, repair, insulate, add a layer, replace — each
 * with what it costs to do, what the run would still cost a year, the cost over the years
 * counted, and whether it is safe, in the reader's units and the one rounding rule. The
 * chosen one is marked; the engine's reason for it is said with the run.
 */
import type { RunEstimate } from '../../engine';
import type { DisplayFormat } from './format';
import { OPTION_WORDS } from './words';

/** One option as a person reads it. */
export interface PresentedOption {
  readonly kind: RunEstimate['options'][number]['kind'];
  /** "Insulate: 2 in", "Leave as it is". */
  readonly label: string;
  readonly chosen: boolean;
  readonly installedCost: string;
  /** What the run would still cost a year after this choice. */
  readonly yearlyCost: string;
  /** Installed cost plus the present worth of the yearly costs over the horizon. */
  readonly lifeCycleCost: string;
  readonly payback: string;
  /** "Safe to touch", "Too hot to touch", "Stays dry", "Sweats". */
  readonly safety: string;
  readonly safe: boolean;
}

export function presentOptions(run: RunEstimate, f: DisplayFormat): PresentedOption[] {
  return run.options.map((option) => {
    const words = OPTION_WORDS[option.kind];
    const label = option.thicknessM !== null && option.kind !== 'leave' ? `${words.label}: ${f.thickness(option.thicknessM)}` : words.label;
    const safe = run.cold ? option.meetsDewPoint : option.meetsTouchLimit;
    const safety = run.cold ? (option.meetsDewPoint ? 'Stays dry' : 'Sweats') : option.meetsTouchLimit ? 'Safe to touch' : 'Too hot to touch';
    return {
      kind: option.kind,
      label,
      chosen: option.kind === run.proposed.option,
      installedCost: option.kind === 'leave' ? '—' : f.money(option.installedCost),
      yearlyCost: f.money(option.annualCost),
      lifeCycleCost: f.money(option.lifeCycleCost),
      payback: option.kind === 'leave' ? '—' : f.years(option.simplePaybackYears),
      safety,
      safe,
    };
  });
}
