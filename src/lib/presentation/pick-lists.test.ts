/**
 * The pick-lists every form reads: each engine choice listed once, in our words, in US
 * spelling.
 */
import { describe, expect, it } from 'vitest';
import { AREA_PRESET_IDS, BARE_FINISH_IDS, FITTING_TYPE_IDS, JACKET_IDS, SURFACE_IDS } from '../../engine';
import { AREA_KIND_CHOICES, BARE_FINISH_CHOICES, FITTING_KIND_CHOICES, JACKET_CHOICES, JACKET_GROUPS, surfaceLabel } from './pick-lists';

const values = (choices: readonly { value: string }[]) => choices.map((c) => c.value);

describe('pick-lists', () => {
  it('offer every area kind, bare finish, cover and fitting of the engine exactly once', () => {
    expect([...values(AREA_KIND_CHOICES)].sort()).toEqual([...AREA_PRESET_IDS].sort());
    expect([...values(BARE_FINISH_CHOICES)].sort()).toEqual([...BARE_FINISH_IDS].sort());
    expect([...values(JACKET_CHOICES)].sort()).toEqual([...JACKET_IDS].sort());
    expect([...values(FITTING_KIND_CHOICES)].sort()).toEqual([...FITTING_TYPE_IDS].sort());
  });

  it('group the covers by what a person sees, no group empty', () => {
    expect(JACKET_GROUPS.map((g) => g.label)).toEqual([
      'Metal sheet wrapped round it',
      'Plastic, paper or cloth',
      'Paint or a hard coating',
      'Nothing over the insulation',
    ]);
    for (const group of JACKET_GROUPS) expect(group.choices.length).toBeGreaterThan(0);
  });

  it('name every surface the engine reads, older per-material ones too, as the lists do', () => {
    for (const id of SURFACE_IDS) expect(surfaceLabel(id)).not.toBe(id);
    expect(surfaceLabel('aluminium-jacket')).toBe('Shiny aluminum sheet');
    expect(surfaceLabel('bright-metal')).toBe('Shiny metal');
  });

  it('are written in US spelling', () => {
    const words = [AREA_KIND_CHOICES, BARE_FINISH_CHOICES, JACKET_CHOICES, FITTING_KIND_CHOICES]
      .flat()
      .flatMap((c) => [c.label, c.note ?? ''])
      .concat(JACKET_GROUPS.map((g) => g.label), SURFACE_IDS.map(surfaceLabel))
      .join(' | ');
    expect(words).not.toMatch(/aluminium|colour|galvanis|grey|fibre|draught|vapour/i);
  });
});
