// Uncertainty budget of a clock comparison and the time left to a target height uncertainty.
// Fractional terms (statistical, flicker floor, systematics) and height terms (levelling tie,
// benchmark) add in quadrature; white FM averages as σ1s/√τ (IEEE Std 1139-2008; for white FM
// the uncertainty of the mean frequency over τ is σ_y(τ), common practice). A fractional term
// becomes a height through c²/γ with γ local normal gravity (redshift.ts).
import { ScienceInputError } from "./errors";
import { requireSiteHeight } from "./gravity";
import { heightPerFractionalFrequency } from "./redshift";
import {
  requireFinite,
  requireLatitude,
  requireName,
  requireNonEmpty,
  requireNonNegative,
  requirePositive,
} from "./validate";

/** A budget term: a bare number, or a named one (the name is shown in the budget table). */
export type BudgetTerm = number | { readonly name: string; readonly value: number };

export interface TimeToTargetInput {
  readonly targetHeightUncertaintyM: number;
  /** White-FM σ_y at 1 s of each clock and of the link, combined in quadrature. */
  readonly instabilityAt1s: readonly BudgetTerm[];
  /** Flicker floor of the combined comparison, fractional. */
  readonly flickerFloor?: number;
  /** Systematic uncertainty of each clock, fractional. */
  readonly systematic?: readonly BudgetTerm[];
  /** Height terms, m (levelling tie, benchmark height, …). */
  readonly heightTermsM?: readonly BudgetTerm[];
  readonly latitudeDeg: number;
  readonly heightM: number;
  /** Valid averaging time so far, s. */
  readonly accumulatedS?: number;
  /** Valid data time per wall-clock time, in (0, 1]. */
  readonly uptime?: number;
  /** Now, for the date the target is reached. */
  readonly now?: Date | string;
}

export interface BudgetRow {
  readonly term: string;
  readonly fractional: number;
  readonly heightM: number;
}

export interface TimeToTargetResult {
  readonly reachable: boolean;
  /** Total valid averaging time needed, s. */
  readonly neededS: number | null;
  /** Valid averaging time still to collect, s. */
  readonly leftS: number | null;
  /** Wall-clock time still to run at the given uptime, s. */
  readonly wallClockLeftS: number | null;
  /** ISO 8601 date the target is reached (needs `now`). */
  readonly eta: string | null;
  /** Best height uncertainty reachable (τ → ∞), m. */
  readonly floorM: number;
  /** The largest term of the budget; when not reachable, the largest term that does not average down. */
  readonly dominant: string;
  /** The budget at budgetAtS (τ → ∞ when null: the floor budget). */
  readonly budget: readonly BudgetRow[];
  readonly budgetAtS: number | null;
  /** Combined white-FM σ_y at 1 s. */
  readonly combinedInstabilityAt1s: number;
}

interface NamedValue {
  readonly name: string;
  readonly value: number;
}

function named(
  terms: readonly BudgetTerm[] | undefined,
  field: string,
  label: string,
): NamedValue[] {
  if (terms === undefined) return [];
  if (!Array.isArray(terms)) throw new ScienceInputError(field, "must be an array");
  return terms.map((t, i) => {
    const value = typeof t === "number" ? t : t.value;
    requireNonNegative(value, typeof t === "number" ? `${field}[${i}]` : `${field}[${i}].value`);
    const name =
      typeof t === "number" ? `${label} ${i + 1}` : requireName(t.name, `${field}[${i}].name`);
    return { name, value };
  });
}

const quadrature = (values: readonly number[]) => Math.sqrt(values.reduce((s, v) => s + v * v, 0));

interface Budget {
  readonly sigma1s: number;
  readonly flicker: number;
  readonly systematic: NamedValue[];
  readonly heights: NamedValue[];
  /** Metres per unit fractional frequency. */
  readonly mPerFractional: number;
  readonly accumulatedS: number;
  readonly uptime: number;
  readonly now: Date | null;
}

function readNow(now: Date | string | undefined): Date | null {
  if (now === undefined) return null;
  const date = typeof now === "string" ? new Date(now) : now;
  if (!(date instanceof Date) || !Number.isFinite(date.getTime())) {
    throw new ScienceInputError("now", "must be a valid date or ISO 8601 string");
  }
  return date;
}

function readUptime(uptime: number): number {
  requireFinite(uptime, "uptime");
  if (!(uptime > 0 && uptime <= 1)) {
    throw new ScienceInputError(
      "uptime",
      `must be in (0, 1] (valid data per wall-clock time), got ${uptime}`,
    );
  }
  return uptime;
}

function readBudget(input: TimeToTargetInput): Budget {
  requireLatitude(input.latitudeDeg);
  requireSiteHeight(input.heightM);
  requireNonEmpty(input.instabilityAt1s, "instabilityAt1s");
  const instabilities = named(input.instabilityAt1s, "instabilityAt1s", "instability");
  const sigma1s = quadrature(instabilities.map((t) => t.value));
  if (!(sigma1s > 0)) throw new ScienceInputError("instabilityAt1s", "must not all be zero");
  return {
    sigma1s,
    flicker:
      input.flickerFloor === undefined ? 0 : requireNonNegative(input.flickerFloor, "flickerFloor"),
    systematic: named(input.systematic, "systematic", "systematic clock"),
    heights: named(input.heightTermsM, "heightTermsM", "height term"),
    mPerFractional: heightPerFractionalFrequency(input.latitudeDeg, input.heightM),
    accumulatedS:
      input.accumulatedS === undefined ? 0 : requireNonNegative(input.accumulatedS, "accumulatedS"),
    uptime: input.uptime === undefined ? 1 : readUptime(input.uptime),
    now: readNow(input.now),
  };
}

/** Budget rows; averagingS null means the limit τ → ∞ (statistical term 0). */
function rows(b: Budget, averagingS: number | null): BudgetRow[] {
  const fromFractional = (term: string, fractional: number): BudgetRow => ({
    term,
    fractional,
    heightM: fractional * b.mPerFractional,
  });
  const statistical = averagingS === null ? 0 : b.sigma1s / Math.sqrt(averagingS);
  const out = [fromFractional("statistical", statistical)];
  if (b.flicker > 0) out.push(fromFractional("flicker floor", b.flicker));
  for (const s of b.systematic) out.push(fromFractional(s.name, s.value));
  for (const h of b.heights)
    out.push({ term: h.name, fractional: h.value / b.mPerFractional, heightM: h.value });
  return out;
}

function floorSquaredM2(b: Budget): number {
  const fractional2 = b.flicker ** 2 + b.systematic.reduce((s, t) => s + t.value ** 2, 0);
  return fractional2 * b.mPerFractional ** 2 + b.heights.reduce((s, t) => s + t.value ** 2, 0);
}

function largest(budget: readonly BudgetRow[], skipStatistical: boolean): string {
  let best: BudgetRow | null = null;
  for (const row of budget) {
    if (skipStatistical && row.term === "statistical") continue;
    if (best === null || row.heightM > best.heightM) best = row;
  }
  return best?.term ?? "statistical";
}

/** Height uncertainty (m) after a total valid averaging time averagingS (s). */
export function heightUncertaintyAt(input: TimeToTargetInput, averagingS: number): number {
  const b = readBudget(input);
  requirePositive(averagingS, "averagingS");
  const statM = (b.sigma1s / Math.sqrt(averagingS)) * b.mPerFractional;
  return Math.sqrt(statM * statM + floorSquaredM2(b));
}

function etaFrom(now: Date | null, wallClockLeftS: number): string | null {
  if (now === null) return null;
  const ms = now.getTime() + wallClockLeftS * 1000;
  // Dates beyond ±8.64e15 ms cannot be written in ISO 8601 by Date.
  return Math.abs(ms) <= 8.64e15 ? new Date(ms).toISOString() : null;
}

/** Averaging time needed to reach the target, what is left, and the budget. */
export function timeToTarget(input: TimeToTargetInput): TimeToTargetResult {
  const target = requirePositive(input.targetHeightUncertaintyM, "targetHeightUncertaintyM");
  const b = readBudget(input);
  const floorM = Math.sqrt(floorSquaredM2(b));
  const common = { floorM, combinedInstabilityAt1s: b.sigma1s };
  // The statistical part may use what the floor leaves of the target, in quadrature.
  const statAllowedM2 = target * target - floorSquaredM2(b);
  const statAllowed = Math.sqrt(Math.max(statAllowedM2, 0)) / b.mPerFractional;
  const neededS = (b.sigma1s / statAllowed) ** 2;
  if (!(statAllowedM2 > 0) || !Number.isFinite(neededS)) {
    const budget = rows(b, null);
    return {
      reachable: false,
      neededS: null,
      leftS: null,
      wallClockLeftS: null,
      eta: null,
      dominant: largest(budget, true),
      budget,
      budgetAtS: null,
      ...common,
    };
  }
  const leftS = Math.max(neededS - b.accumulatedS, 0);
  const wallClockLeftS = leftS / b.uptime;
  if (!Number.isFinite(wallClockLeftS)) {
    throw new ScienceInputError(
      "uptime",
      `${b.uptime} is too small: the wall-clock time overflows`,
    );
  }
  const budgetAtS = Math.max(neededS, b.accumulatedS);
  const budget = rows(b, budgetAtS);
  return {
    reachable: true,
    neededS,
    leftS,
    wallClockLeftS,
    eta: etaFrom(b.now, wallClockLeftS),
    dominant: largest(budget, false),
    budget,
    budgetAtS,
    ...common,
  };
}
