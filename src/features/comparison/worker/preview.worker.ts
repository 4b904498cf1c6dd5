// The local preview of a series file, off the main thread: read in slices, parsed line by line
// with the same reader as the server, then a quick ADEV of the file's own samples.
import {
  analyseSeries,
  buildSeriesGrid,
  createSeriesReader,
  type SeriesAnalysisResult,
} from "../../../../shared/comparison";
import { readLines } from "../lib/line-slicer";
import { previewSamplesMax, type PreviewMessage, type PreviewRequest } from "./preview-protocol";

const post = (message: PreviewMessage) => self.postMessage(message);

function quickAnalysis(
  times: number[],
  values: number[],
  tau0S: number | null,
): { analysis: SeriesAnalysisResult | null; note: string | null } {
  if (tau0S === null || times.length < 2)
    return { analysis: null, note: "Too few samples for a stability estimate." };
  try {
    const grid = buildSeriesGrid([{ times, values }], tau0S);
    return { analysis: analyseSeries(grid), note: null };
  } catch (error) {
    return { analysis: null, note: error instanceof Error ? error.message : String(error) };
  }
}

async function preview(request: PreviewRequest): Promise<void> {
  const times: number[] = [];
  const values: number[] = [];
  const reader = createSeriesReader({
    valueKind: request.valueKind,
    nominalRatio: request.nominalRatio,
    onSample: (t, y) => {
      if (times.length >= previewSamplesMax) return;
      times.push(t);
      values.push(y);
    },
  });
  const bytesTotal = request.file.size;
  let lastPost = 0;
  await readLines(
    request.file,
    (text, lineNo) => reader.line(text, lineNo),
    (bytesRead) => {
      const now = performance.now();
      if (now - lastPost < 100 && bytesRead < bytesTotal) return;
      lastPost = now;
      post({ type: "progress", bytesRead, bytesTotal });
    },
  );
  const summary = reader.finish();
  const bad = summary.badRows > 0 || summary.problem !== null;
  const { analysis, note } = bad
    ? { analysis: null, note: "No stability estimate while rows are bad." }
    : quickAnalysis(times, values, summary.tau0S);
  post({
    type: "done",
    summary,
    analysis,
    analysisNote: note,
    analysedSamples: bad ? 0 : times.length,
  });
}

self.onmessage = (event: MessageEvent<PreviewRequest>) => {
  preview(event.data).catch((error: unknown) =>
    post({ type: "failed", message: error instanceof Error ? error.message : String(error) }),
  );
};
