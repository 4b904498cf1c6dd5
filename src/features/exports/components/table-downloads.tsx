// Every campaign table as CSV, one download each.
import { archiveTables, heightTables } from "../../../../shared/schemas/campaign-archive";
import { tableLabels } from "../lib/table-labels";
import { DownloadButton } from "./download-button";

export function TableDownloads({ campaignId }: { campaignId: string }) {
  return (
    <ul className="grid gap-3 sm:grid-cols-2">
      {archiveTables.map((table) => (
        <li
          key={table}
          className="flex flex-col gap-2 rounded-lg border border-line bg-surface p-4"
        >
          <div>
            <p className="font-semibold">{tableLabels[table].label}</p>
            <p className="text-sm text-muted">
              {tableLabels[table].holds}
              {heightTables.includes(table) && " · carries the official-heights caution"}
            </p>
          </div>
          <DownloadButton
            campaignId={campaignId}
            target={{ kind: "table", table }}
            label={`Download ${tableLabels[table].label} (CSV)`}
          />
        </li>
      ))}
    </ul>
  );
}
