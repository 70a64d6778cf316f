/**
 * Fittings as equivalent lengths of bare pipe of the same size — common practice
 * (a rule of thumb, no source read): a bare flanged valve with its bonnet and two
 * flanges loses about as much as 1.2 m of bare pipe, a bare flange pair about
 * 0.4 m. For a 6-in valve this is 0.63 m² of surface, consistent with the US DOE
 * Steam Tip Sheet #2 remark that a 6-in gate valve may have more than 6 ft²
 * (0.56 m²). A removable insulated cover is taken as the same equivalent length
 * insulated like the pipe. The check against US DOE Steam Tip Sheet #17's cover
 * savings is in __tests__/fittings.test.ts.
 */
export const FITTING_EQUIVALENTS = [
  { id: 'valve', name: 'Valve (flanged, with bonnet)', equivalentLengthM: 1.2 },
  { id: 'flange-pair', name: 'Pair of flanges', equivalentLengthM: 0.4 },
] as const satisfies readonly { id: string; name: string; equivalentLengthM: number }[];

export const VALVE_EQUIVALENT_LENGTH_M = FITTING_EQUIVALENTS[0].equivalentLengthM;
export const FLANGE_PAIR_EQUIVALENT_LENGTH_M = FITTING_EQUIVALENTS[1].equivalentLengthM;
