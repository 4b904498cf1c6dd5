// One export (a table's CSV, the GeoJSON, the archive) saved through the browser's download.
import type { ArchiveTable } from "../../../../shared/schemas/campaign-archive";
import { downloadBlob } from "../../../lib/download";
import { transfer, type TransferProgress } from "./transfer";

export type ExportTarget =
  { kind: "table"; table: ArchiveTable } | { kind: "geojson" } | { kind: "archive" };

const base = (campaignId: string) => `/campaigns/${encodeURIComponent(campaignId)}/exports`;

function pathOf(campaignId: string, target: ExportTarget): string {
  if (target.kind === "table") return `${base(campaignId)}/tables/${target.table}.csv`;
  if (target.kind === "geojson") return `${base(campaignId)}/geojson`;
  return `${base(campaignId)}/archive.zip`;
}

function fallbackName(target: ExportTarget): string {
  const day = new Date().toISOString().slice(0, 10);
  if (target.kind === "table") return `equipot-${target.table}-${day}.csv`;
  if (target.kind === "geojson") return `equipot-map-${day}.geojson`;
  return `equipot-archive-${day}.zip`;
}

export async function downloadExport(
  campaignId: string,
  target: ExportTarget,
  onProgress: (progress: TransferProgress) => void,
): Promise<void> {
  const { blob, fileName } = await transfer({
    method: "GET",
    path: pathOf(campaignId, target),
    onProgress,
  });
  downloadBlob(fileName ?? fallbackName(target), blob);
}
