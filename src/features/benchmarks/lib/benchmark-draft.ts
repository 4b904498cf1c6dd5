// The benchmark form as typed (text; the height's σ in mm, as people quote it) and as stored (SI:
// metres). parseDecimal accepts a decimal comma; unreadable text becomes NaN, so the schema names
// the field.
import type { BenchmarkFields, BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { parseDecimal } from "../../../lib/format";

export interface BenchmarkDraft {
  code: string;
  description: string;
  /** ° */
  latitudeDeg: string;
  /** ° */
  longitudeDeg: string;
  /** m */
  heightM: string;
  /** mm (stored in m) */
  heightSigmaM: string;
  heightSystem: string;
  datum: string;
  source: string;
}

/** Rounds away binary noise from the unit change (0.3 mm must be 0.0003 m, not 0.00030000000000000003). */
const clean = (value: number) => (Number.isFinite(value) ? Number(value.toPrecision(12)) : value);

export function fieldsFromDraft(d: BenchmarkDraft): BenchmarkFields {
  return {
    code: d.code,
    description: d.description,
    latitudeDeg: parseDecimal(d.latitudeDeg),
    longitudeDeg: parseDecimal(d.longitudeDeg),
    heightM: parseDecimal(d.heightM),
    heightSigmaM: clean(parseDecimal(d.heightSigmaM) / 1000),
    heightSystem: d.heightSystem,
    datum: d.datum,
    source: d.source,
  };
}

const shown = (value: number) => String(Number(value.toPrecision(12)));

/** A new benchmark starts with the height system and datum of the campaign's others, if any. */
export function draftFromBenchmark(
  b: BenchmarkView | null,
  like?: Pick<BenchmarkView, "heightSystem" | "datum">,
): BenchmarkDraft {
  return {
    code: b?.code ?? "",
    description: b?.description ?? "",
    latitudeDeg: b === null ? "" : shown(b.latitudeDeg),
    longitudeDeg: b === null ? "" : shown(b.longitudeDeg),
    heightM: b === null ? "" : shown(b.heightM),
    heightSigmaM: b === null ? "" : shown(b.heightSigmaM * 1000),
    heightSystem: b?.heightSystem ?? like?.heightSystem ?? "",
    datum: b?.datum ?? like?.datum ?? "",
    source: b?.source ?? "",
  };
}
