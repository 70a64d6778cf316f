/**
 * The formatters a report writes its figures with — the reader's unit system and the plant's
 * currency — so the web page, the e-mail and the PDF of a version carry the same strings. The
 * one place the report takes its number formatting from.
 */
import { formatCo2, formatFigure, formatMoney, formatQuantity, formatRange, formatYears, displayUnit, type DisplayQuantity, type UnitSystem } from '../units-display';

/** A low–high range written with its unit once. */
export interface ReportRange {
  readonly text: string;
}

export interface ReportFormat {
  readonly system: UnitSystem;
  readonly currency: string;
  number(value: number): string;
  money(value: number): string;
  moneyRange(low: number, high: number): ReportRange;
  quantity(valueSI: number, quantity: DisplayQuantity): string;
  quantityRange(lowSI: number, highSI: number, quantity: DisplayQuantity): ReportRange;
  unit(quantity: DisplayQuantity): string;
  temperature(celsius: number): string;
  thickness(metres: number): string;
  years(value: number | null): string;
  yearsRange(low: number, high: number): ReportRange;
  co2(kg: number): string;
  co2Range(lowKg: number, highKg: number): ReportRange;
  percent(fraction: number): string;
}

const FRACTION_GLYPHS: Record<number, string> = { 1: '⅛', 2: '¼', 3: '⅜', 4: '½', 5: '⅝', 6: '¾', 7: '⅞' };

/** The formatters for one report's reader. */
export function reportFormat(system: UnitSystem, currency: string): ReportFormat {
  const money = (value: number) => formatMoney(value, currency);
  const quantity = (valueSI: number, q: DisplayQuantity) => formatQuantity(valueSI, q, system);
  const years = (value: number | null) => (value === null ? 'no payback' : formatYears(value));
  return {
    system,
    currency,
    number: (value) => formatFigure(value),
    money,
    moneyRange: (low, high) => ({ text: formatRange(low, high, money) }),
    quantity,
    quantityRange: (low, high, q) => ({ text: formatRange(low, high, (v) => quantity(v, q)) }),
    unit: (q) => displayUnit(q, system).symbol,
    temperature: (celsius) => formatQuantity(celsius, 'temperature', system, { significant: 4, maxDecimals: 0 }),
    thickness: (metres) => {
      if (system === 'SI') return `${Math.round(metres * 1000)} mm`;
      const eighths = Math.round((metres / 0.0254) * 8);
      if (Math.abs((metres / 0.0254) * 8 - eighths) < 0.05 && eighths > 0) {
        const whole = Math.floor(eighths / 8);
        return `${whole === 0 ? '' : String(whole)}${FRACTION_GLYPHS[eighths % 8] ?? ''} in`;
      }
      return quantity(metres, 'thickness');
    },
    years,
    yearsRange: (low, high) => ({ text: formatRange(low, high, (v) => formatYears(v)) }),
    co2: (kg) => formatCo2(kg),
    co2Range: (low, high) => ({ text: formatRange(low, high, (v) => formatCo2(v)) }),
    percent: (fraction) => `${formatFigure(fraction * 100)} %`,
  };
}
