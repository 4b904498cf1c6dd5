// Which reader the server should use for a chosen file, and how a refused row is named for people:
// CSV problems by line (the header is line 1), GeoJSON ones by feature, whole-file ones as such.
import type { RefusedFile } from "../../../lib/api-error";

export type BenchmarkFileFormat = "csv" | "geojson";

/** By the file name's extension; null when it is neither. */
export function formatOfFileName(fileName: string): BenchmarkFileFormat | null {
  const extension = /\.([^.]+)$/.exec(fileName.trim())?.[1]?.toLowerCase();
  if (extension === "csv" || extension === "txt") return "csv";
  if (extension === "geojson" || extension === "json") return "geojson";
  return null;
}

/** "Line 3, latitude_deg: …", "Feature 2, geometry: …" or "The file: …". */
export function describeRowProblem(
  format: BenchmarkFileFormat,
  problem: RefusedFile["rows"][number],
): string {
  const where =
    problem.row <= 0 || problem.field === "file"
      ? "The file"
      : `${format === "csv" ? "Line" : "Feature"} ${problem.row}, ${problem.field}`;
  return `${where}: ${problem.message}`;
}
