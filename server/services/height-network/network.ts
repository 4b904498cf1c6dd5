// The campaign's levelling network as the adjustment takes it: closed field-book sections (the
// mean of the forward run and the negated backward run, the forward run's length) and imported
// ties; benchmarks named as marks are the fixed points; marks that no chain joins to one are set
// aside as unconnected (the science core refuses them). Pure, so it is tested without a database.
import { summariseSection, type BookSetup } from "../../../shared/levelling-book";

export type ObservationSource = "field-book" | "imported";

export interface NetworkObservation {
  sourceId: string;
  source: ObservationSource;
  /** The file name for an imported tie, "" for a field-book section. */
  origin: string;
  fromMark: string;
  toMark: string;
  deltaM: number;
  lengthKm: number;
  /** The observation's own σ, m; null: σ per √km × √length. */
  ownSigmaM: number | null;
}

export interface SectionInput {
  id: string;
  fromMark: string;
  toMark: string;
  classId: string;
  setups: BookSetup[];
}

export interface TieInput {
  id: string;
  fromMark: string;
  toMark: string;
  deltaM: number;
  lengthKm: number;
  sigmaM: number | null;
  source: string;
}

export interface BenchmarkInput {
  id: string;
  code: string;
  heightM: number;
  heightSigmaM: number;
}

/** A closed section, or null when its book does not reduce (it could not have been closed). */
export function sectionObservation(section: SectionInput): NetworkObservation | null {
  const summary = summariseSection(section.classId, section.setups);
  if (summary.closure === null || !(summary.forward.lengthKm > 0)) return null;
  // The backward run goes to → from, so its height difference has the opposite sign.
  const deltaM = (summary.forward.cumulativeM - summary.backward.cumulativeM) / 2;
  return {
    sourceId: section.id,
    source: "field-book",
    origin: "",
    fromMark: section.fromMark,
    toMark: section.toMark,
    deltaM: Math.round(deltaM * 1e7) / 1e7,
    lengthKm: summary.forward.lengthKm,
    ownSigmaM: null,
  };
}

export const tieObservation = (tie: TieInput): NetworkObservation => ({
  sourceId: tie.id,
  source: "imported",
  origin: tie.source,
  fromMark: tie.fromMark,
  toMark: tie.toMark,
  deltaM: tie.deltaM,
  lengthKm: tie.lengthKm,
  ownSigmaM: tie.sigmaM,
});

export interface PreparedNetwork {
  /** Observations adjusted: not excluded and joined to a benchmark. */
  used: NetworkObservation[];
  fixed: BenchmarkInput[];
  unconnected: string[];
}

function find(parent: Map<string, string>, mark: string): string {
  let at = mark;
  for (let up = parent.get(at); up !== undefined && up !== at; up = parent.get(at)) at = up;
  return at;
}

/** Groups marks by the chains of observations between them (union–find). */
function components(observations: NetworkObservation[]): Map<string, string> {
  const parent = new Map<string, string>();
  for (const o of observations) {
    for (const m of [o.fromMark, o.toMark]) if (!parent.has(m)) parent.set(m, m);
    const a = find(parent, o.fromMark);
    const b = find(parent, o.toMark);
    if (a !== b) parent.set(a, b);
  }
  return parent;
}

export function prepareNetwork(
  observations: NetworkObservation[],
  benchmarks: BenchmarkInput[],
  excluded: readonly string[],
): PreparedNetwork {
  const leftOut = new Set(excluded);
  const kept = observations.filter((o) => !leftOut.has(o.sourceId));
  const parent = components(kept);
  const fixed = benchmarks.filter((b) => parent.has(b.code));
  const tiedRoots = new Set(fixed.map((b) => find(parent, b.code)));
  const used = kept.filter((o) => tiedRoots.has(find(parent, o.fromMark)));
  const unconnected = [...parent.keys()]
    .filter((m) => !tiedRoots.has(find(parent, m)))
    .sort((a, b) => a.localeCompare(b));
  return { used, fixed, unconnected };
}
