// Single exports: one table as CSV, and the map layers as GeoJSON.
import { heightTables, type ArchiveTable } from "../../../shared/schemas/campaign-archive";
import type { Db } from "../../db/client";
import {
  readCampaign,
  readTableRows,
  readUserNames,
  withExportSnapshot,
} from "../../db/repositories/campaign-export";
import { exportFileName, tableCsv, userIdsOf } from "./csv";
import { campaignGeoJson, type FeatureCollection } from "./geojson";

export interface TableExport {
  fileName: string;
  csv: string;
  /** True when the rows carry heights: the answer then also names the caution in a header. */
  heights: boolean;
}

export async function exportTableCsv(
  db: Db,
  campaignId: string,
  table: ArchiveTable,
  now: Date,
): Promise<TableExport> {
  return withExportSnapshot(db, async (tx) => {
    const campaign = await readCampaign(tx, campaignId);
    const rows = await readTableRows(tx, campaignId, table);
    const names = await readUserNames(tx, userIdsOf(rows));
    return {
      fileName: exportFileName(campaign.name, table, "csv", now),
      csv: tableCsv(table, rows, names),
      heights: heightTables.includes(table),
    };
  });
}

export async function exportGeoJson(
  db: Db,
  campaignId: string,
  now: Date,
): Promise<{ fileName: string; collection: FeatureCollection }> {
  return withExportSnapshot(db, async (tx) => {
    const campaign = await readCampaign(tx, campaignId);
    const collection = campaignGeoJson({
      sites: await readTableRows(tx, campaignId, "sites"),
      benchmarks: await readTableRows(tx, campaignId, "benchmarks"),
      legs: await readTableRows(tx, campaignId, "legs"),
      crates: await readTableRows(tx, campaignId, "crates"),
    });
    return { fileName: exportFileName(campaign.name, "map", "geojson", now), collection };
  });
}
