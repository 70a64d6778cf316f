import type { InsulationMaterial } from './data/insulation-materials';
import type { RunWarning } from './run';
import type { SeriesEntry } from './run-options';
import { formatNumber } from './schema-helpers';

/** A run's surfaces today at design air, and the needs they are judged against. */
export interface HazardFacts {
  readonly burnNeed: boolean;
  readonly sweatNeed: boolean;
  readonly touchLimitC: number;
  /** Dew point of the wettest hour, °C. */
  readonly wetDewPointC: number;
  /** Share of the run bare today. */
  readonly bareFraction: number;
  /** The insulated surface at design air, or null on a run with no insulation today. */
  readonly insulatedDesignC: number | null;
  readonly bareDesignC: number;
  readonly uncoveredCount: number;
}

/** The wettest hour's dew point as a message gives it. */
function dewPointWords(f: HazardFacts): string {
  return formatNumber(Math.round(f.wetDewPointC * 10) / 10);
}

/** The hazards of a run as it stands: burns on hot surfaces, sweating on cold ones, bare fittings too. */
export function hazardsToday(f: HazardFacts): RunWarning[] {
  const hazards: RunWarning[] = [];
  if (f.bareFraction === 0 && f.insulatedDesignC !== null) {
    const surfaceC = f.insulatedDesignC;
    if (f.burnNeed && surfaceC > f.touchLimitC) {
      hazards.push({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: `On the hottest day the insulated surface reaches about ${Math.round(surfaceC)} °C, above the ${f.touchLimitC} °C touch limit (ASTM C1055 basis): it can burn on contact.` });
    }
    if (f.sweatNeed && surfaceC < f.wetDewPointC) {
      hazards.push({ code: 'SURFACE_BELOW_DEW_POINT', message: `In the wettest hour the insulated surface falls to about ${formatNumber(Math.round(surfaceC * 10) / 10)} °C, below the ${dewPointWords(f)} °C dew point: it will sweat.` });
    }
  } else if (f.bareFraction > 0) {
    if (f.burnNeed && f.bareDesignC > f.touchLimitC) {
      hazards.push({ code: 'SURFACE_ABOVE_TOUCH_LIMIT', message: `The bare pipe runs at about ${Math.round(f.bareDesignC)} °C, above the ${f.touchLimitC} °C touch limit (ASTM C1055 basis): it can burn on contact.` });
    }
    if (f.sweatNeed && f.bareDesignC < f.wetDewPointC) {
      hazards.push({ code: 'SURFACE_BELOW_DEW_POINT', message: `The bare pipe runs at about ${formatNumber(Math.round(f.bareDesignC * 10) / 10)} °C, below the ${dewPointWords(f)} °C dew point of the wettest hour: it will sweat or frost.` });
    }
  }
  const n = f.uncoveredCount;
  if (n > 0 && f.burnNeed && f.bareDesignC > f.touchLimitC) {
    hazards.push({ code: 'BARE_FITTINGS_ABOVE_TOUCH_LIMIT', message: `${n} bare fitting${n === 1 ? '' : 's'} on this line run at about ${Math.round(f.bareDesignC)} °C, above the ${f.touchLimitC} °C touch limit: removable covers would stop burns.` });
  }
  if (n > 0 && f.sweatNeed && f.bareDesignC < f.wetDewPointC) {
    hazards.push({ code: 'BARE_FITTINGS_BELOW_DEW_POINT', message: `${n} bare fitting${n === 1 ? '' : 's'} on this line sit at about ${formatNumber(Math.round(f.bareDesignC * 10) / 10)} °C, below the ${dewPointWords(f)} °C dew point: they will drip onto whatever is below; removable covers with a vapor retarder stop it.` });
  }
  return hazards;
}

/** Where nothing in stock meets a run's need: which need, and the gap in plain words. */
export interface NoStock {
  readonly need: 'touch' | 'dew';
  readonly message: string;
}

/** The plain words for a run where no stock thickness of the material meets its safety need. */
export function noStockMeetsNeed(
  runLabel: string,
  material: InsulationMaterial,
  series: readonly SeriesEntry[],
  bareDesignC: number,
  f: { readonly burnNeed: boolean; readonly touchLimitC: number; readonly wetDewPointC: number; readonly marginK: number; readonly dewLimitC: number },
): NoStock {
  const thickest = series[series.length - 1];
  const thickestC = thickest?.design?.surfaceC ?? thickest?.avg.surfaceC ?? bareDesignC;
  const thickestMm = formatNumber(Math.round((thickest?.t ?? 0) * 1000));
  return f.burnNeed
    ? { need: 'touch', message: `Run "${runLabel}": no stock thickness of ${material.name.toLowerCase()} keeps the surface at or under the ${f.touchLimitC} °C touch limit on the hottest day; the thickest (${thickestMm} mm) leaves it at about ${Math.round(thickestC)} °C, ${formatNumber(Math.round((thickestC - f.touchLimitC) * 10) / 10)} K over. Guard the line or choose another material.` }
    : { need: 'dew', message: `Run "${runLabel}": no stock thickness of ${material.name.toLowerCase()} keeps the surface above the ${formatNumber(Math.round(f.wetDewPointC * 10) / 10)} °C dew point (+${f.marginK} K) in the wettest hour; the thickest (${thickestMm} mm) leaves it at about ${formatNumber(Math.round(thickestC * 10) / 10)} °C, ${formatNumber(Math.round((f.dewLimitC - thickestC) * 10) / 10)} K short. Dry the room's air or choose a better material.` };
}
