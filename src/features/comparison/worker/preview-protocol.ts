// Messages between the page and the preview worker.
import type { SeriesAnalysisResult, SeriesFileSummary } from "../../../../shared/comparison";
import type { SeriesValueKind } from "../../../../shared/schemas/comparison";

export interface PreviewRequest {
  file: Blob;
  valueKind: SeriesValueKind;
  nominalRatio?: string;
}

/** The quick ADEV uses at most this many samples (memory: 16 bytes each). */
export const previewSamplesMax = 2_000_000;

export type PreviewMessage =
  | { type: "progress"; bytesRead: number; bytesTotal: number }
  | {
      type: "done";
      summary: SeriesFileSummary;
      /** The quick analysis of the file alone, or null with the reason. */
      analysis: SeriesAnalysisResult | null;
      analysisNote: string | null;
      /** Samples used for the quick analysis (the first ones when the file is larger). */
      analysedSamples: number;
    }
  | { type: "failed"; message: string };
