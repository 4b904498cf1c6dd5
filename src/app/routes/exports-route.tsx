// Exports for the office: each table as CSV, the map layers as GeoJSON, the whole campaign as one
// archive, and (for administrators) an archive brought in as a new campaign.
import { useQueryClient } from "@tanstack/react-query";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { can } from "../../../shared/permissions";
import { LinkButton } from "../../components/button";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { campaignKeys } from "../../features/campaigns/api/keys";
import { DownloadButton } from "../../features/exports/components/download-button";
import { ImportArchiveForm } from "../../features/exports/components/import-archive-form";
import { TableDownloads } from "../../features/exports/components/table-downloads";
import { useLocalSync } from "../../lib/sync-context";
import { useSession } from "../../lib/use-session";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { paths } from "../paths";

export function ExportsRoute() {
  const { campaignId, role } = useCampaign();
  const session = useSession();
  const queryClient = useQueryClient();
  const { scheduler } = useLocalSync();
  // The refreshed session names the new campaign: reload the list and bring its records to this device.
  const afterImport = () => {
    void queryClient.invalidateQueries({ queryKey: campaignKeys.all });
    void scheduler.runNow().catch(() => undefined);
  };
  const adminSomewhere =
    session.status === "signed-in" && session.memberships.some((m) => m.role === "admin");
  if (!can(role, "campaign.export"))
    return (
      <NotAllowed
        what="Exports are for geodesists, reviewers and administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  return (
    <>
      <PageHeader
        title="Exports"
        lead="The campaign's records as files, for reading and for keeping"
      />
      <div className="flex flex-col gap-8">
        <Notice tone="attention" title="Campaign results">
          {officialHeightsCaution} Every export with heights says so.
        </Notice>
        <section aria-labelledby="archive-heading" className="flex flex-col gap-3">
          <h2 id="archive-heading" className="text-xl font-semibold">
            Whole campaign
          </h2>
          <p className="text-muted">
            One ZIP file: every record (campaign.json), each table as CSV, the photos and files, the
            comparison series and a README. It can be imported on any Equipot server.
          </p>
          <div className="max-w-md">
            <DownloadButton
              campaignId={campaignId}
              target={{ kind: "archive" }}
              label="Download the campaign archive (ZIP)"
              showBar
            />
          </div>
        </section>
        <section aria-labelledby="map-heading" className="flex flex-col gap-3">
          <h2 id="map-heading" className="text-xl font-semibold">
            Map layers
          </h2>
          <p className="text-muted">Sites, benchmarks and legs as GeoJSON, for any GIS program.</p>
          <div className="max-w-md">
            <DownloadButton
              campaignId={campaignId}
              target={{ kind: "geojson" }}
              label="Download GeoJSON"
            />
          </div>
        </section>
        <section aria-labelledby="tables-heading" className="flex flex-col gap-3">
          <h2 id="tables-heading" className="text-xl font-semibold">
            Tables as CSV
          </h2>
          <p className="text-muted">
            Times in UTC (ISO 8601), SI units in the column names, each person's name beside their
            id.
          </p>
          <TableDownloads campaignId={campaignId} />
        </section>
        {adminSomewhere && (
          <section aria-labelledby="import-heading" className="flex flex-col gap-3">
            <h2 id="import-heading" className="text-xl font-semibold">
              Import an archive as a new campaign
            </h2>
            <p className="text-muted">
              The archive's records go into a new, empty campaign; this campaign is not changed.
            </p>
            <ImportArchiveForm
              onImported={afterImport}
              campaignLink={(id, name) => (
                <LinkButton to={paths.campaign(id)}>Open “{name}”</LinkButton>
              )}
            />
          </section>
        )}
      </div>
    </>
  );
}
