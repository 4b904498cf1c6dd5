// Rows of the comparison tables as the API shows them.
import type {
  ComparisonFileView,
  ComparisonRunView,
  GapsSummary,
} from "../../../shared/schemas/comparison";
import type { ComparisonFileRow, ComparisonRunRow } from "../../db/repositories/comparison";

export const presentRun = (row: ComparisonRunRow): ComparisonRunView => ({
  id: row.id,
  campaignId: row.campaignId,
  name: row.name,
  remoteSiteId: row.remoteSiteId,
  remoteClockId: row.remoteClockId,
  referenceClockId: row.referenceClockId,
  linkId: row.linkId,
  linkName: row.linkName,
  remoteMark: row.remoteMark,
  referenceHeightM: row.referenceHeightM,
  referenceHeightSigmaM: row.referenceHeightSigmaM,
  targetHeightUncertaintyM: row.targetHeightUncertaintyM,
  plannedUptime: row.plannedUptime,
  notes: row.notes,
  dataRevision: row.dataRevision,
  version: row.version,
  createdAt: row.createdAt.toISOString(),
  updatedAt: row.updatedAt.toISOString(),
});

export const presentFile = (row: ComparisonFileRow): ComparisonFileView => ({
  id: row.id,
  runId: row.runId,
  fileName: row.fileName,
  byteSize: row.byteSize,
  valueKind: row.valueKind,
  nominalRatio: row.nominalRatio,
  tau0S: row.tau0S,
  rowCount: row.rowCount,
  validCount: row.validCount,
  firstAt: row.firstAt.toISOString(),
  lastAt: row.lastAt.toISOString(),
  gaps: row.gaps as GapsSummary,
  uploadedAt: row.uploadedAt.toISOString(),
  uploadedByName: row.uploadedByName,
});
