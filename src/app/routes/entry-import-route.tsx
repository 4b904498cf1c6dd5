import { useNavigate, useParams, useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import { EntryImport } from "../../features/field-imports/components/entry-import";
import { importKind } from "../../features/field-imports/parse/mapping";
import { useLocalSite } from "../../features/sites/hooks/use-local-sites";
import { LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { NotFoundHere } from "../not-found-here";
import { paths } from "../paths";

export function EntryImportRoute() {
  const { campaignId, role } = useCampaign();
  const { siteId = "" } = useParams();
  const [search] = useSearchParams();
  const navigate = useNavigate();
  const site = useLocalSite(campaignId, siteId);
  const kind = importKind.safeParse(search.get("kind") ?? "temperatures");
  const back = paths.siteBoard(campaignId, siteId);

  if (!can(role, "entry.record"))
    return (
      <NotAllowed what="Importing logger readings is for the crew and logistics." backHref={back} />
    );
  if (!kind.success)
    return (
      <Notice tone="danger" title="Unknown kind of import">
        The address asks for “{search.get("kind")}”; Equipot imports shock-log or temperatures
        files.
      </Notice>
    );
  if (site === undefined) return <Loading label="Reading the site on this device…" />;
  if (site === null)
    return (
      <NotFoundHere title="Site not found" backHref={paths.sites(campaignId)}>
        It may have been deleted, or it is not on this device yet.
      </NotFoundHere>
    );
  const title = kind.data === "temperatures" ? "Import temperatures" : "Import shock logger events";
  return (
    <>
      <PageHeader
        title={title}
        lead={`At ${site.name} · from a logger's CSV file, on this device`}
      />
      <div className="mb-4">
        <LinkButton tone="quiet" className="px-0" to={back}>
          Back to {site.name}
        </LinkButton>
      </div>
      <EntryImport
        campaignId={campaignId}
        siteId={siteId}
        kind={kind.data}
        canRecord
        doneLabel={kind.data === "temperatures" ? "Show the temperatures" : `Back to ${site.name}`}
        onDone={() =>
          navigate(kind.data === "temperatures" ? paths.temperatures(campaignId, siteId) : back)
        }
      />
    </>
  );
}
