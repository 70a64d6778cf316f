/**
 * What a consultant sees of lagging already on a run: sound, wet through, or crushed. A wet
 * or crushed layer is worked out as a layer with a higher conductivity or a smaller thickness,
 * so its surface temperature (burns, sweating) follows as well as its loss.
 *
 * Common practice (our own typical values, not from a standard): lagging that is wet through
 * conducts about three times as well as dry fibrous insulation (water's conductivity, about
 * 0.6 W/(m·K), is some fifteen times that of dry mineral wool, and a soaked layer holds only
 * part of its volume as water); crushed lagging keeps about half its thickness. A measured
 * surface temperature replaces both: the reading's condition factor is taken against this
 * layer, so measured loss is what the estimate uses.
 */
export const LAGGING_CONDITIONS = [
  { id: 'sound', name: 'Sound', conductivityFactor: 1, thicknessFactor: 1 },
  { id: 'wet', name: 'Wet through', conductivityFactor: 3, thicknessFactor: 1 },
  { id: 'crushed', name: 'Crushed or slumped', conductivityFactor: 1, thicknessFactor: 0.5 },
] as const satisfies readonly { id: string; name: string; conductivityFactor: number; thicknessFactor: number }[];

export type LaggingConditionId = (typeof LAGGING_CONDITIONS)[number]['id'];
export const LAGGING_CONDITION_IDS = LAGGING_CONDITIONS.map((c) => c.id) as [LaggingConditionId, ...LaggingConditionId[]];
