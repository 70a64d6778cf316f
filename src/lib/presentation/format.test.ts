import { describe, expect, it } from 'vitest';
import { displayFormat } from './format';
import { NBSP, roundToStep, stepFor } from './rounding';

const us = displayFormat({ system: 'US', currency: 'USD' });
const si = displayFormat({ system: 'SI', currency: 'USD' });
/** Writes the expected text with a visible "~" for each no-break space. */
const nb = (text: string) => text.replace(/~/g, NBSP);

describe('the rounding rule', () => {
  it.each([
    { value: 1234.5, significant: 3, step: 10 },
    { value: 0.012345, significant: 3, step: 0.0001 },
    { value: -5.27, significant: 3, step: 0.01 },
    { value: 999.6, significant: 3, step: 1 },
    { value: 6187.9, significant: 2, step: 100 },
  ])('stepFor($value, $significant) = $step', ({ value, significant, step }) => {
    expect(stepFor(value, significant)).toBeCloseTo(step, 12);
  });

  it.each([
    { value: 2912.4, step: 100, rounded: 2900 },
    { value: 0.30000001, step: 0.1, rounded: 0.3 },
    { value: 0.15, step: 0.1, rounded: 0.2 },
    { value: -2.5, step: 1, rounded: -3 },
    { value: -0.2, step: 1, rounded: 0 },
  ])('roundToStep($value, $step) = $rounded, halves away from zero, no binary dust', ({ value, step, rounded }) => {
    expect(roundToStep(value, step)).toBe(rounded);
  });

  it.each([
    { value: 1234.5, text: '1,230' },
    { value: 0.012345, text: '0.0123' },
    { value: -5.27, text: '−5.27' },
    { value: 0, text: '0' },
    { value: 1_234_567, text: '1,230,000' },
    { value: 99.96, text: '100' },
    { value: Number.NaN, text: '—' },
  ])('a plain figure keeps 3 significant figures: $value → $text', ({ value, text }) => {
    expect(us.number(value)).toBe(text);
  });
});

describe('money', () => {
  it.each([
    { value: 4234.2, text: '$4,230' },
    { value: 9.75, text: '$10' },
    { value: 10.04, text: '$10' },
    { value: 123.4, text: '$123' },
    { value: 0, text: '$0' },
    { value: 0.3, text: 'under~$1' },
    { value: -1234, text: '−$1,230' },
    { value: 1_234_567, text: '$1,230,000' },
  ])('$value → $text (whole currency units, 3 significant figures)', ({ value, text }) => {
    expect(us.money(value)).toBe(nb(text));
  });

  it.each([
    { currency: 'EUR', text: '€4,230' },
    { currency: 'GBP', text: '£4,230' },
    { currency: 'AUD', text: '$4,230' },
    { currency: 'DKK', text: 'kr~4,230' },
    { currency: 'not-a-code', text: 'not-a-code~4,230' },
  ])('in $currency: $text (the plant’s own currency, its narrow symbol)', ({ currency, text }) => {
    expect(displayFormat({ system: 'SI', currency }).money(4234.2)).toBe(nb(text));
  });

  it('reads the same in US and SI units, for any amount', () => {
    for (const value of [0.4, 9.75, 10.04, 99.5, 3641.7, 7483.2, 123_456]) expect(si.money(value)).toBe(us.money(value));
  });

  it.each([
    { low: 2912.4, high: 6187.9, text: '$2,900–$6,200', ends: ['$2,900', '$6,200'] },
    { low: 12.3, high: 48.7, text: '$12–$49', ends: ['$12', '$49'] },
    { low: 0.2, high: 3.4, text: '$0–$3', ends: ['$0', '$3'] },
    { low: 980, high: 1040, text: '$1,000', ends: ['$1,000', '$1,000'] },
    { low: -420, high: 1830, text: '−$400–$1,800', ends: ['−$400', '$1,800'] },
  ])('a range shares one step, 2 figures of its larger end: $text', ({ low, high, text, ends }) => {
    const range = us.moneyRange(low, high);
    expect(range.text).toBe(text);
    expect([range.low, range.high]).toEqual(ends);
  });
});

describe('quantities in the reader’s units', () => {
  it.each([
    { system: 'US', celsius: 169.4, text: '337~°F' },
    { system: 'SI', celsius: 169.4, text: '169~°C' },
    { system: 'US', celsius: 60, text: '140~°F' },
    { system: 'SI', celsius: -5.3, text: '−5~°C' },
    { system: 'US', celsius: -5.3, text: '22~°F' },
    { system: 'SI', celsius: 0.2, text: '0~°C' },
  ] as const)('temperature $celsius °C in $system → $text (whole degrees)', ({ system, celsius, text }) => {
    expect(displayFormat({ system, currency: 'USD' }).temperature(celsius)).toBe(nb(text));
  });

  it.each([
    { system: 'US', quantity: 'length', value: 30, text: '98.4~ft' },
    { system: 'SI', quantity: 'length', value: 39.929, text: '39.9~m' },
    { system: 'SI', quantity: 'heatPerLength', value: 491.2, text: '491~W/m' },
    { system: 'US', quantity: 'heatPerLength', value: 491.2, text: '511~Btu/h~per~ft' },
    { system: 'SI', quantity: 'energyPerYear', value: 1234.5, text: '1,230~GJ' },
    { system: 'US', quantity: 'energyPerYear', value: 1234.5, text: '1,170~MMBtu' },
    { system: 'US', quantity: 'gaugePressure', value: 689.476, text: '100~psig' },
    { system: 'SI', quantity: 'steamRate', value: 12.34, text: '12.3~kg/h' },
    { system: 'US', quantity: 'power', value: 15_000, text: '51,200~Btu/h' },
  ] as const)('$quantity $value in $system → $text', ({ system, quantity, value, text }) => {
    expect(displayFormat({ system, currency: 'USD' }).quantity(value, quantity)).toBe(nb(text));
  });

  it.each([
    { system: 'SI', low: 1180.4, high: 1623.9, text: '1,200–1,600~GJ', ends: ['1,200', '1,600'] },
    { system: 'US', low: 1180.4, high: 1623.9, text: '1,100–1,500~MMBtu', ends: ['1,100', '1,500'] },
    { system: 'SI', low: 3.21, high: 7.89, text: '3.2–7.9~GJ', ends: ['3.2', '7.9'] },
  ] as const)('an energy range in $system → $text', ({ system, low, high, text, ends }) => {
    const range = displayFormat({ system, currency: 'USD' }).quantityRange(low, high, 'energyPerYear');
    expect(range.text).toBe(nb(text));
    expect([range.low, range.high]).toEqual(ends);
  });

  it.each([
    { system: 'US', meters: 0.0381, text: '1½~in' },
    { system: 'US', meters: 0.0254, text: '1~in' },
    { system: 'US', meters: 0.0127, text: '½~in' },
    { system: 'US', meters: 0.0762, text: '3~in' },
    { system: 'US', meters: 0.03, text: '1.18~in' },
    { system: 'SI', meters: 0.04, text: '40~mm' },
    { system: 'SI', meters: 0.0254, text: '25~mm' },
  ] as const)('an insulation thickness in $system: $meters m → $text', ({ system, meters, text }) => {
    expect(displayFormat({ system, currency: 'USD' }).thickness(meters)).toBe(nb(text));
  });

  it.each([
    { years: 0.4, text: '5~months' },
    { years: 0.04, text: '1~month' },
    { years: 2.43, text: '2.4~years' },
    { years: 14.6, text: '15~years' },
    { years: null, text: 'no payback' },
  ])('payback $years → $text', ({ years, text }) => {
    expect(us.years(years)).toBe(nb(text));
  });

  it.each([
    { low: 1.0, high: 1.35, text: '1.0–1.4~years' },
    { low: 0.5, high: 0.9, text: '6–11~months' },
    { low: 0.6, high: 12.4, text: '1–12~years' },
  ])('a payback range $low–$high → $text', ({ low, high, text }) => {
    expect(us.yearsRange(low, high).text).toBe(nb(text));
  });

  it.each([
    { kg: 22_740, text: '22.7~t~CO₂' },
    { kg: 452.3, text: '452~kg~CO₂' },
  ])('CO₂ $kg kg → $text', ({ kg, text }) => {
    expect(us.co2(kg)).toBe(nb(text));
  });

  it('a CO₂ range takes the unit of its larger end', () => {
    expect(us.co2Range(820, 1460).text).toBe(nb('0.8–1.5~t~CO₂'));
  });

  it('a fraction as a percentage: 0.78 → 78 %', () => {
    expect(us.percent(0.78)).toBe(nb('78~%'));
  });

  it('keeps every number with its unit: no plain space in any figure with a unit', () => {
    const texts = [
      us.temperature(-5),
      us.quantity(491, 'heatPerLength'),
      si.quantity(12, 'steamRate'),
      us.co2(22_000),
      us.years(2),
      us.quantityRange(1, 2, 'energyPerYear').text,
      displayFormat({ system: 'SI', currency: 'SEK' }).money(12_345),
    ];
    for (const text of texts) expect(text).not.toMatch(/ /);
  });
});
