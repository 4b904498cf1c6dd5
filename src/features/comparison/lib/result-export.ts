// The height result as a CSV a colleague can open without Equipot: the caution first (campaign
// results, not official heights), then the figures and the budget, heights in metres.
import Papa from "papaparse";
import type { HeightResultView } from "../../../../shared/schemas/comparison";

export function resultCsv(runName: string, result: HeightResultView): string {
  const { clock, levelled, comparison, timeToTarget: t } = result;
  // Comment lines as written, before the CSV proper (a reader skips lines starting with #).
  const head = [
    `# ${result.caution}`,
    `# Equipot comparison run: ${runName.replace(/[\r\n]+/g, " ")}`,
    `# Computed at ${result.computedAt}`,
  ];
  const rows: (string | number)[][] = [["quantity", "value", "unit"]];
  if (clock !== null) {
    rows.push(["mean fractional frequency", clock.meanFractional, "1"]);
    rows.push(["geopotential difference", clock.geopotentialDifference, "m²/s²"]);
    rows.push(["height difference (clocks)", clock.heightDifferenceM, "m"]);
    rows.push(["its standard uncertainty", clock.sigmaM, "m"]);
  }
  if (levelled !== null) {
    rows.push([
      `height difference (levelled, mark ${levelled.mark})`,
      levelled.heightDifferenceM,
      "m",
    ]);
    rows.push(["its standard uncertainty", levelled.sigmaM, "m"]);
  }
  if (comparison !== null) {
    rows.push(["clocks minus levelled", comparison.differenceM, "m"]);
    rows.push(["z = |difference| / σ", comparison.z, "1"]);
  }
  rows.push(["target height uncertainty", t.input.targetHeightUncertaintyM, "m"]);
  rows.push(["reachable", t.reachable ? "yes" : "no", ""]);
  if (t.eta !== null) rows.push(["expected date", t.eta, "ISO 8601"]);
  if (t.wallClockLeftS !== null) rows.push(["wall-clock time left", t.wallClockLeftS, "s"]);
  rows.push(["dominant term", t.dominant, ""]);
  rows.push([]);
  rows.push(["budget term", "kind", "fractional", "height (m)"]);
  for (const r of result.budget) rows.push([r.term, r.kind, r.fractional, r.heightM]);
  rows.push(["combined", "", "", result.combinedHeightUncertaintyM]);
  return [...head, Papa.unparse(rows, { newline: "\n" })].join("\n") + "\n";
}
