// The levelling field book reduced the same way on the tablet (live, while typing) and on the
// server (when a section is closed): the current setups, their warnings and the misclosure.
import { DEFAULT_SIGHT_BALANCE_LIMITS } from "./science/levelling/balance";
import {
  findLevellingClass,
  misclosureToleranceM,
  type LevellingClass,
  type MisclosureCheck,
} from "./science/levelling/misclosure";
import { runningReduction, type RunningReduction } from "./science/levelling/running";
import type { LevellingClosure } from "./schemas/levelling";

export type BookRun = "forward" | "backward";

export interface BookSetup {
  readonly id: string;
  readonly run: BookRun;
  readonly number: number;
  readonly backsightM: number;
  readonly foresightM: number;
  readonly backsightDistanceM: number;
  readonly foresightDistanceM: number;
  readonly recordedAt: string;
}

export type SetupField = "backsightM" | "foresightM" | "backsightDistanceM" | "foresightDistanceM";

export interface SetupWarning {
  /** "" for a warning about the whole run. */
  readonly setupId: string;
  readonly run: BookRun;
  /** 0 for a warning about the whole run. */
  readonly number: number;
  readonly field: SetupField | null;
  readonly message: string;
}

export interface SectionSummary {
  readonly forward: RunningReduction;
  readonly backward: RunningReduction;
  /**
   * When both runs have at least one setup (and some sight length, else there is no K to judge
   * by). K = mean of the two runs' lengths (one-way length).
   */
  readonly misclosure: MisclosureCheck | null;
  readonly warnings: readonly SetupWarning[];
  /** Same condition as misclosure. */
  readonly closure: LevellingClosure | null;
}

/** Warning thresholds of the field book. */
export const BOOK_LIMITS = {
  // Sights ≤ 50 m for precise work (DOMAIN.md: practice).
  maxSightM: DEFAULT_SIGHT_BALANCE_LIMITS.maxSightM,
  // BS and FS distances within 5 m at a setup (memory).
  maxSetupImbalanceM: DEFAULT_SIGHT_BALANCE_LIMITS.maxSetupImbalanceM,
  // Running imbalance within 10 m over a section (memory).
  maxRunImbalanceM: DEFAULT_SIGHT_BALANCE_LIMITS.maxCumulativeImbalanceM,
  // Readings near the staff foot pass close to the ground, where refraction is worst (common practice).
  minReadingM: 0.3,
} as const;

function timeOf(iso: string): number {
  const t = Date.parse(iso);
  return Number.isNaN(t) ? Number.NEGATIVE_INFINITY : t;
}

/** True when a was recorded after b; equal times fall back to the id so every device agrees. */
function isNewer(a: BookSetup, b: BookSetup): boolean {
  const ta = timeOf(a.recordedAt);
  const tb = timeOf(b.recordedAt);
  return ta !== tb ? ta > tb : a.id > b.id;
}

/** The latest setup per (run, number) — a correction is a newer setup with the same number — sorted by number. */
export function currentSetups<S extends BookSetup>(
  setups: readonly S[],
): { forward: S[]; backward: S[] } {
  const latest = new Map<string, S>();
  for (const s of setups) {
    const key = `${s.run}:${s.number}`;
    const seen = latest.get(key);
    if (seen === undefined || isNewer(s, seen)) latest.set(key, s);
  }
  const of = (run: BookRun) =>
    [...latest.values()].filter((s) => s.run === run).sort((a, b) => a.number - b.number);
  return { forward: of("forward"), backward: of("backward") };
}

const fixed = (value: number, digits: number) => value.toFixed(digits).replace("-", "−");

/** The checks on one setup's own readings and distances. */
export function setupWarnings(s: BookSetup): SetupWarning[] {
  const out: SetupWarning[] = [];
  const warn = (field: SetupField | null, message: string) =>
    out.push({ setupId: s.id, run: s.run, number: s.number, field, message });
  const sights = [
    ["backsightDistanceM", "Backsight", s.backsightDistanceM],
    ["foresightDistanceM", "Foresight", s.foresightDistanceM],
  ] as const;
  for (const [field, label, m] of sights) {
    if (m > BOOK_LIMITS.maxSightM)
      warn(field, `${label} of ${fixed(m, 1)} m is longer than ${BOOK_LIMITS.maxSightM} m`);
  }
  const imbalanceM = s.backsightDistanceM - s.foresightDistanceM;
  if (Math.abs(imbalanceM) > BOOK_LIMITS.maxSetupImbalanceM) {
    warn(
      null,
      `Backsight and foresight distances differ by ${fixed(Math.abs(imbalanceM), 1)} m (more than ${BOOK_LIMITS.maxSetupImbalanceM} m)`,
    );
  }
  const readings = [
    ["backsightM", "Backsight", s.backsightM],
    ["foresightM", "Foresight", s.foresightM],
  ] as const;
  for (const [field, label, m] of readings) {
    if (m < BOOK_LIMITS.minReadingM)
      warn(
        field,
        `${label} reading ${fixed(m, 4)} m is below ${BOOK_LIMITS.minReadingM} m: the line of sight runs close to the ground`,
      );
  }
  return out;
}

function runWarning(run: BookRun, reduction: RunningReduction): SetupWarning[] {
  const imbalanceM = reduction.imbalanceM;
  if (Math.abs(imbalanceM) <= BOOK_LIMITS.maxRunImbalanceM) return [];
  const name = run === "forward" ? "Forward run" : "Backward run";
  return [
    {
      setupId: "",
      run,
      number: 0,
      field: null,
      message: `${name}: backsight distances total ${fixed(Math.abs(imbalanceM), 1)} m ${imbalanceM > 0 ? "more" : "less"} than foresight distances (more than ${BOOK_LIMITS.maxRunImbalanceM} m apart)`,
    },
  ];
}

// Rounding to the micrometre keeps floating-point noise in the sums (readings are to 0.1 mm)
// from deciding a verdict exactly at the tolerance.
const toMicrometre = (m: number) => Math.round(m * 1e6) / 1e6;

/** Forward + backward (the backward run, measured B→A, has the opposite sign) against k·√K. */
function misclosureOf(
  forwardDeltaM: number,
  backwardDeltaM: number,
  lengthKm: number,
  levellingClass: LevellingClass,
): MisclosureCheck {
  const misclosureM = toMicrometre(forwardDeltaM + backwardDeltaM);
  const toleranceM = misclosureToleranceM(levellingClass, lengthKm, "section");
  const usedFraction = Math.abs(misclosureM) / toleranceM;
  return { misclosureM, lengthKm, toleranceM, withinTolerance: usedFraction <= 1, usedFraction };
}

/** No rule compares a setup with "the matching" one of the other run: the runs need not share turning points. */
export function summariseSection(classId: string, setups: readonly BookSetup[]): SectionSummary {
  const levellingClass = findLevellingClass(classId);
  const current = currentSetups(setups);
  const forward = runningReduction(current.forward);
  const backward = runningReduction(current.backward);
  const warnings = [
    ...current.forward.flatMap(setupWarnings),
    ...runWarning("forward", forward),
    ...current.backward.flatMap(setupWarnings),
    ...runWarning("backward", backward),
  ];
  const lengthKm = (forward.lengthKm + backward.lengthKm) / 2;
  if (current.forward.length === 0 || current.backward.length === 0 || !(lengthKm > 0)) {
    return { forward, backward, misclosure: null, warnings, closure: null };
  }
  const forwardDeltaM = toMicrometre(forward.cumulativeM);
  const backwardDeltaM = toMicrometre(backward.cumulativeM);
  const misclosure = misclosureOf(forwardDeltaM, backwardDeltaM, lengthKm, levellingClass);
  const closure: LevellingClosure = {
    forwardDeltaM,
    backwardDeltaM,
    lengthKm,
    misclosureM: misclosure.misclosureM,
    toleranceM: misclosure.toleranceM,
    withinTolerance: misclosure.withinTolerance,
  };
  return { forward, backward, misclosure, warnings, closure };
}

/** "−3.2 mm" */
export function formatMillimetres(m: number): string {
  const mm = Math.round(m * 1e4) / 10;
  return `${fixed(mm === 0 ? 0 : mm, 1)} mm`;
}

/** "Misclosure −3.2 mm of ±6.0 mm allowed (Second-order, Class I, K = 1.00 km)" */
export function describeMisclosure(check: MisclosureCheck, levellingClass: LevellingClass): string {
  return `Misclosure ${formatMillimetres(check.misclosureM)} of ±${formatMillimetres(check.toleranceM)} allowed (${levellingClass.name}, K = ${check.lengthKm.toFixed(2)} km)`;
}
