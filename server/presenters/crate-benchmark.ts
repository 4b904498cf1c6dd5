import type { CrateView } from "../../shared/schemas/crates";
import type { CrateRow } from "../db/repositories/crates-benchmarks";

export const presentCrate = (row: CrateRow): CrateView => ({
  id: row.id,
  campaignId: row.campaignId,
  label: row.label,
  contents: row.contents,
  weightKg: row.weightKg,
  maxShockG: row.maxShockG,
  temperatureMinC: row.temperatureMinC,
  temperatureMaxC: row.temperatureMaxC,
  notes: row.notes,
  instrument: row.instrument,
  maxTiltDeg: row.maxTiltDeg,
  state: row.state,
  version: row.version,
  updatedAt: row.updatedAt.toISOString(),
  deletedAt: row.deletedAt?.toISOString() ?? null,
});
