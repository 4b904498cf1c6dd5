import type { HeightTieView } from "../../shared/schemas/height-network";
import type { HeightTieRow } from "../db/repositories/height-network";
import type { NetworkObservation } from "../services/height-network/network";

export const presentTie = (row: HeightTieRow): HeightTieView => ({
  id: row.id,
  fromMark: row.fromMark,
  toMark: row.toMark,
  deltaM: row.deltaM,
  lengthKm: row.lengthKm,
  sigmaM: row.sigmaM,
  source: row.source,
  importedAt: row.importedAt.toISOString(),
  importedByName: row.importedByName,
});

/** GET …/height-network/observations: one row of the network as it stands now. */
export interface NetworkObservationView {
  sourceId: string;
  source: "field-book" | "imported";
  origin: string;
  fromMark: string;
  toMark: string;
  deltaM: number;
  lengthKm: number;
  /** The observation's own σ, m; null when it comes from σ per √km. */
  sigmaM: number | null;
}

export const presentObservation = (o: NetworkObservation): NetworkObservationView => ({
  sourceId: o.sourceId,
  source: o.source,
  origin: o.origin,
  fromMark: o.fromMark,
  toMark: o.toMark,
  deltaM: o.deltaM,
  lengthKm: o.lengthKm,
  sigmaM: o.ownSigmaM,
});
