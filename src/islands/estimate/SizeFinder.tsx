/**
 * "How big is the pipe?" for someone who does not know its size: wrap a string or a tape once
 * round a bare stretch, type the length, and pick from the nearest sizes of the standards the
 * plant's market is likely to have. The picture is our own drawing.
 */
import { useId, useState } from 'react';
import { useFormContext } from 'react-hook-form';
import { toSI, type MarketId } from '../../engine';
import { formatQuantity } from '../../lib/presentation/rounding';
import { sizesForCircumference, type SizeMatch } from '../../lib/size-from-circumference';
import { parseTyped, type UnitSystem } from '../../lib/units-display';
import type { DraftValues } from './draft';
import { pipeStandard } from './draft';

/** What a standard's pipe is, in words an owner uses. */
const KIND_WORDS: Record<string, string> = {
  'ASME-B36.10M': 'steel pipe',
  'ASME-B36.19M': 'stainless pipe',
  'ASTM-B88-L': 'copper tube',
  'ASTM-B88-K': 'copper tube (thick wall)',
  'EN-10220': 'metric steel tube',
  'ASTM-A270-SANITARY': 'food-grade stainless tube',
  'DIN-11850-2': 'metric food-grade stainless tube',
};

function matchLabel(match: SizeMatch, system: UnitSystem): string {
  const kind = KIND_WORDS[match.standard] ?? match.standard;
  const size = match.standard.startsWith('ASME') ? `NPS ${match.size}` : match.standard.startsWith('ASTM') ? `${match.size} in` : match.size;
  return `${size} ${kind} · ${formatQuantity(match.outerDiameterM, 'diameter', system, 3)} across`;
}

/** A pipe in section with a string looped once round it. */
function StringPicture() {
  return (
    <svg className="size-picture" viewBox="0 0 120 72" role="img" aria-label="A string wrapped once round a pipe, its two ends meeting">
      <rect x="4" y="22" width="112" height="28" rx="3" className="size-picture-pipe" />
      <ellipse cx="60" cy="36" rx="7" ry="17" className="size-picture-string" />
      <path d="M60 53 q10 10 26 12" className="size-picture-string" />
      <path d="M60 19 q12 -12 30 -13" className="size-picture-string size-picture-end" />
      <text x="94" y="70" className="size-picture-text">string</text>
    </svg>
  );
}

interface Props {
  base: `estimate.runs.${number}`;
  market: MarketId;
  system: UnitSystem;
}

export function SizeFinder({ base, market, system }: Props) {
  const { setValue } = useFormContext<DraftValues>();
  const id = useId();
  const [typed, setTyped] = useState('');
  const [chosen, setChosen] = useState<string | null>(null);
  const unit = system === 'US' ? 'in' : 'cm';
  const value = parseTyped(typed);
  const circumferenceM = typeof value === 'number' ? toSI('length', value, unit) : NaN;
  const matches = sizesForCircumference(circumferenceM, market);

  function choose(match: SizeMatch) {
    const standard = pipeStandard(match.standard);
    const dirty = { shouldDirty: true, shouldValidate: true } as const;
    setValue(`${base}.pipe.standard`, match.standard, dirty);
    setValue(`${base}.pipe.size`, match.size, dirty);
    setValue(`${base}.pipe.schedule`, match.entry.defaultSchedule, dirty);
    if (standard) setValue(`${base}.pipe.material`, standard.defaultMaterial, dirty);
    setChosen(`${match.standard}|${match.size}`);
  }

  return (
    <div className="size-finder">
      <div className="size-finder-how">
        <StringPicture />
        <p className="field-hint">
          Wrap a string or a tape once round a bare stretch of the pipe (beside a valve, or where the lagging is
          off), mark where it meets, and measure it. We work out the size.
        </p>
      </div>
      <div className="field">
        <label htmlFor={`${id}-around`} className="field-label">
          Distance round the pipe ({unit})
        </label>
        <div className="number-box">
          <input
            id={`${id}-around`}
            type="text"
            inputMode="decimal"
            autoComplete="off"
            className="input number-input"
            value={typed}
            onChange={(event) => setTyped(event.target.value)}
          />
          <span className="number-unit" aria-hidden="true">
            {unit}
          </span>
        </div>
      </div>
      {typed.trim() !== '' && (
        <fieldset className="size-matches" aria-live="polite">
          <legend className="field-label">{matches.length > 0 ? 'It is most likely one of these' : 'No size we list is that far round'}</legend>
          {matches.length === 0 && (
            <p className="field-hint">Check the measurement (round bare pipe, not the lagging), or choose the size under “More about this run”.</p>
          )}
          {matches.map((match) => {
            const key = `${match.standard}|${match.size}`;
            return (
              <label key={key} className="choice" htmlFor={`${id}-${key}`}>
                <input
                  type="radio"
                  id={`${id}-${key}`}
                  name={`${id}-match`}
                  className="choice-input"
                  checked={chosen === key}
                  onChange={() => choose(match)}
                />
                <span className="choice-label">{matchLabel(match, system)}</span>
              </label>
            );
          })}
        </fieldset>
      )}
    </div>
  );
}
