// README.txt of the campaign archive: what is inside, in plain words.
import {
  archiveFormat,
  archiveTables,
  type ArchiveTable,
} from "../../../shared/schemas/campaign-archive";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import type { JsonRow } from "../../db/repositories/campaign-export";

export function archiveReadme(
  campaignName: string,
  now: Date,
  tables: ReadonlyMap<ArchiveTable, JsonRow[]>,
): string {
  const counts = archiveTables.map(
    (t) => `  tables/${t}.csv`.padEnd(40) + `${tables.get(t)?.length ?? 0} rows`,
  );
  return [
    `Equipot campaign archive: ${campaignName}`,
    `Exported ${now.toISOString()} (UTC).`,
    "",
    `CAUTION: ${officialHeightsCaution}`,
    "",
    "Contents",
    `  campaign.json                   every record, format "${archiveFormat.name}" version ${archiveFormat.version}`,
    "  tables/<table>.csv              the same records as CSV, one file per table",
    "  attachments/<sha256>            the bytes of each attached photo or file, named by its SHA-256",
    "  series/<file id>.csv            each comparison data file: time, value, valid",
    "  README.txt                      this text",
    "",
    "Rows per table",
    ...counts,
    "",
    "Conventions",
    "  Times are ISO 8601 in UTC. SI units; the unit is part of each column name (_m, _deg, _s, _kg, _c, _g).",
    "  A column ending in _by holds a person's id and the column after it their name.",
    "  Values that are lists or objects are written as JSON text.",
    "  Text beginning with = + - or @ starts with an apostrophe in the CSV files, so that a",
    "  spreadsheet never runs it as a formula; campaign.json holds the text unchanged.",
    "  Tables with heights end with a 'caution' column repeating the statement above.",
    "",
    "Importing",
    "  An administrator can import this file as a new campaign (Exports page). Records get new ids;",
    "  people are kept where their account exists on that server.",
    "",
  ].join("\r\n");
}
