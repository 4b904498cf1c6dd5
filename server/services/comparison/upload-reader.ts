// The shared series reader's rules (τ0 from the first intervals, gaps, two samples within one
// interval) over the byte-fed upload parser, so the server reads a file with the same outcome as
// createSeriesReader does, line for line. Samples are handed on in order and only while no row
// has been bad.
import {
  createGapTracker,
  medianInterval,
  TAU0_INTERVALS,
  type GapTracker,
  type SeriesFileSummary,
  type SeriesReaderOptions,
} from "../../../shared/comparison";
import { comparisonLimits, type SeriesRowError } from "../../../shared/schemas/comparison";
import { createUploadParser } from "./upload-parser";

export interface UploadReader {
  line(buf: Buffer, start: number, end: number, lineNo: number): void;
  readonly failed: boolean;
  finish(): SeriesFileSummary;
}

const { min: TAU0_MIN, max: TAU0_MAX } = comparisonLimits.tau0S;

export function createUploadReader(options: SeriesReaderOptions): UploadReader {
  const parser = createUploadParser(options);
  const gridErrors: SeriesRowError[] = [];
  let gridBad = 0;
  let buffer: { t: number; y: number; line: number }[] | null = [];
  let tracker: GapTracker | null = null;
  let tau0S: number | null = options.tau0S ?? null;
  let firstT: number | null = null;
  let lastT: number | null = null;
  let problem: string | null = null;

  const failed = () => parser.badRows + gridBad > 0 || problem !== null;

  function place(t: number, y: number, line: number, at: GapTracker) {
    if (at.next(t) === null) {
      gridBad++;
      if (gridErrors.length < comparisonLimits.errorsListed) {
        gridErrors.push({
          line,
          field: "time",
          message: `two samples within one interval (τ0 = ${tau0S} s): this one is less than τ0/2 after the previous`,
        });
      }
      return;
    }
    firstT ??= t;
    lastT = t;
    if (!failed()) options.onSample(t, y);
  }

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
    for (const s of waiting) place(s.t, s.y, s.line, tracker);
  }

  return {
    line(buf, start, end, lineNo) {
      const sample = parser.line(buf, start, end, lineNo);
      if (sample === null) return;
      if (tracker !== null) place(sample.t, sample.y, lineNo, tracker);
      else if (buffer !== null) {
        buffer.push({ t: sample.t, y: sample.y, line: lineNo });
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
