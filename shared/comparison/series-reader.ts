// One uploaded file, line by line: the parser's rows, τ0 (given, or the median of the first
// intervals: the first samples wait in a small buffer until it is known), gaps and samples that
// share an interval. Samples are handed on in order and only while no row has been bad, so a
// caller can store as it goes and roll back at the end if anything was wrong.
import {
  comparisonLimits,
  type GapsSummary,
  type SeriesRowError,
  type SeriesValueKind,
} from "../schemas/comparison";
import { createGapTracker, medianInterval, TAU0_INTERVALS, type GapTracker } from "./series-grid";
import { createSeriesParser } from "./series-parser";

export interface SeriesReaderOptions {
  readonly valueKind: SeriesValueKind;
  readonly nominalRatio?: string;
  /** The sample interval when known (e.g. the run's other files), s. */
  readonly tau0S?: number;
  /** Receives each good sample in order while no row has been bad. */
  readonly onSample: (t: number, y: number) => void;
}

export interface SeriesFileSummary {
  readonly rows: number;
  readonly validRows: number;
  readonly badRows: number;
  /** The first bad rows, in line order. */
  readonly errors: SeriesRowError[];
  /** A problem of the whole file (no data, τ0 out of range), or null. */
  readonly problem: string | null;
  readonly tau0S: number | null;
  readonly firstT: number | null;
  readonly lastT: number | null;
  readonly gaps: GapsSummary;
}

export interface SeriesReader {
  line(text: string, lineNo: number): void;
  /** True once any row was bad (nothing more is handed on). */
  readonly failed: boolean;
  finish(): SeriesFileSummary;
}

interface Pending {
  t: number;
  y: number;
  line: number;
}

const { min: TAU0_MIN, max: TAU0_MAX } = comparisonLimits.tau0S;

export function createSeriesReader(options: SeriesReaderOptions): SeriesReader {
  const parser = createSeriesParser(options);
  const gridErrors: SeriesRowError[] = [];
  let gridBad = 0;
  let buffer: Pending[] | null = [];
  let tracker: GapTracker | null = null;
  let tau0S: number | null = options.tau0S ?? null;
  let firstT: number | null = null;
  let lastT: number | null = null;
  let problem: string | null = null;

  const failed = () => parser.badRows + gridBad > 0 || problem !== null;

  function place(s: Pending, t: GapTracker) {
    if (t.next(s.t) === null) {
      gridBad++;
      if (gridErrors.length < comparisonLimits.errorsListed) {
        gridErrors.push({
          line: s.line,
          field: "time",
          message: `two samples within one interval (τ0 = ${tau0S} s): this one is less than τ0/2 after the previous`,
        });
      }
      return;
    }
    firstT ??= s.t;
    lastT = s.t;
    if (!failed()) options.onSample(s.t, s.y);
  }

  /** Fixes τ0 from the buffered samples and replays them. */
  function settle() {
    const waiting = buffer ?? [];
    buffer = null;
    tau0S ??= medianInterval(waiting.map((s) => s.t));
    if (tau0S === null) {
      problem = "the file holds fewer than 2 samples, so its sample interval is unknown";
      return;
    }
    if (!(tau0S >= TAU0_MIN && tau0S <= TAU0_MAX)) {
      problem = `the sample interval ${tau0S} s is outside ${TAU0_MIN} … ${TAU0_MAX} s`;
      return;
    }
    tracker = createGapTracker(tau0S);
    for (const s of waiting) place(s, tracker);
  }

  return {
    line(text, lineNo) {
      const sample = parser.line(text, lineNo);
      if (sample === null) return;
      const s = { t: sample.t, y: sample.y, line: lineNo };
      if (tracker !== null) place(s, tracker);
      else if (buffer !== null) {
        buffer.push(s);
        if (tau0S !== null || buffer.length > TAU0_INTERVALS) settle();
      }
    },
    get failed() {
      return failed();
    },
    finish() {
      if (buffer !== null && (parser.rows > 0 || parser.badRows === 0)) settle();
      if (parser.rows === 0 && parser.badRows === 0) problem = "the file holds no data rows";
      const errors = [...parser.errors, ...gridErrors]
        .sort((a, b) => a.line - b.line)
        .slice(0, comparisonLimits.errorsListed);
      return {
        rows: parser.rows,
        validRows: parser.validRows,
        badRows: parser.badRows + gridBad,
        errors,
        problem,
        tau0S,
        firstT,
        lastT,
        gaps: tracker?.gaps.summary() ?? { count: 0, missingSamples: 0, list: [] },
      };
    },
  };
}
