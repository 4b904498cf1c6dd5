// Reduction of spirit-levelling readings by rise and fall: per setup ΔH = BS − FS (a rise when
// positive), with the arithmetic check ΣBS − ΣFS = ΣRise − ΣFall = last − first (Ghilani & Wolf,
// "Elementary Surveying", differential levelling notes; standard field-book practice).
import { ScienceInputError } from "../errors";
import { requireName, requireNonEmpty, requireNonNegative, requireRange } from "../validate";

export interface LevellingSetup {
  /** Staff readings, m. */
  readonly backsightM: number;
  readonly foresightM: number;
  /** Sight lengths, m. */
  readonly backsightDistanceM: number;
  readonly foresightDistanceM: number;
  /** The point the foresight is on, when it is a mark that ends a section (else a turning point). */
  readonly foresightPoint?: string;
}

export interface LevellingLine {
  readonly startPoint: string;
  readonly setups: readonly LevellingSetup[];
}

export interface LevellingSection {
  readonly from: string;
  readonly to: string;
  /** Height difference to − from, m. */
  readonly deltaM: number;
  /** One-way length K, km (sum of sight lengths). */
  readonly lengthKm: number;
  readonly setupCount: number;
  readonly backsightDistanceM: number;
  readonly foresightDistanceM: number;
  /** ΣBS distances − ΣFS distances, m. */
  readonly imbalanceM: number;
}

export interface LineReduction {
  readonly sections: readonly LevellingSection[];
  readonly totalDeltaM: number;
  readonly totalLengthKm: number;
  readonly check: ArithmeticCheck;
}

export interface ArithmeticCheck {
  readonly sumBacksightM: number;
  readonly sumForesightM: number;
  readonly sumRiseM: number;
  readonly sumFallM: number;
  /** |(ΣBS − ΣFS) − (ΣRise − ΣFall)|, m: rounding only when the book is consistent. */
  readonly discrepancyM: number;
}

// Plausible ranges (DOMAIN.md §3): staff readings 0 … 5 m, sights 0 … 100 m; a little margin.
const MAX_READING_M = 6;
const MAX_SIGHT_M = 200;

function checkSetup(s: LevellingSetup, field: string): void {
  requireRange(s.backsightM, `${field}.backsightM`, -MAX_READING_M, MAX_READING_M);
  requireRange(s.foresightM, `${field}.foresightM`, -MAX_READING_M, MAX_READING_M);
  requireNonNegative(s.backsightDistanceM, `${field}.backsightDistanceM`);
  requireNonNegative(s.foresightDistanceM, `${field}.foresightDistanceM`);
  requireRange(s.backsightDistanceM, `${field}.backsightDistanceM`, 0, MAX_SIGHT_M);
  requireRange(s.foresightDistanceM, `${field}.foresightDistanceM`, 0, MAX_SIGHT_M);
  if (s.foresightPoint !== undefined) requireName(s.foresightPoint, `${field}.foresightPoint`);
}

function arithmeticCheck(setups: readonly LevellingSetup[]): ArithmeticCheck {
  let sumBacksightM = 0;
  let sumForesightM = 0;
  let sumRiseM = 0;
  let sumFallM = 0;
  for (const s of setups) {
    sumBacksightM += s.backsightM;
    sumForesightM += s.foresightM;
    const d = s.backsightM - s.foresightM;
    if (d >= 0) sumRiseM += d;
    else sumFallM -= d;
  }
  const discrepancyM = Math.abs(sumBacksightM - sumForesightM - (sumRiseM - sumFallM));
  return { sumBacksightM, sumForesightM, sumRiseM, sumFallM, discrepancyM };
}

interface OpenSection {
  from: string;
  deltaM: number;
  bsM: number;
  fsM: number;
  count: number;
}

function closeSection(open: OpenSection, to: string): LevellingSection {
  return {
    from: open.from,
    to,
    deltaM: open.deltaM,
    lengthKm: (open.bsM + open.fsM) / 1000,
    setupCount: open.count,
    backsightDistanceM: open.bsM,
    foresightDistanceM: open.fsM,
    imbalanceM: open.bsM - open.fsM,
  };
}

/** Reduces a line of setups to the height differences and lengths of its sections. */
export function reduceLevellingLine(line: LevellingLine): LineReduction {
  requireName(line.startPoint, "startPoint");
  requireNonEmpty(line.setups, "setups");
  const sections: LevellingSection[] = [];
  let open: OpenSection = { from: line.startPoint, deltaM: 0, bsM: 0, fsM: 0, count: 0 };
  line.setups.forEach((s, i) => {
    checkSetup(s, `setups[${i}]`);
    open.deltaM += s.backsightM - s.foresightM;
    open.bsM += s.backsightDistanceM;
    open.fsM += s.foresightDistanceM;
    open.count++;
    if (s.foresightPoint !== undefined) {
      if (s.foresightPoint === open.from) {
        throw new ScienceInputError(
          `setups[${i}].foresightPoint`,
          `closes a section on its own start ${open.from}`,
        );
      }
      sections.push(closeSection(open, s.foresightPoint));
      open = { from: s.foresightPoint, deltaM: 0, bsM: 0, fsM: 0, count: 0 };
    }
  });
  if (open.count > 0) {
    throw new ScienceInputError(
      `setups[${line.setups.length - 1}].foresightPoint`,
      "the line must end on a named point (the last foresight names no mark)",
    );
  }
  return {
    sections,
    totalDeltaM: sections.reduce((s, x) => s + x.deltaM, 0),
    totalLengthKm: sections.reduce((s, x) => s + x.lengthKm, 0),
    check: arithmeticCheck(line.setups),
  };
}
