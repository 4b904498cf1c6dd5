import { siteKindLabels, type SiteView } from "../../../../shared/schemas";
import { LinkButton } from "../../../components/button";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import {
  formatHeightM,
  formatLatitude,
  formatLocalBeside,
  formatLongitude,
  formatUtc,
} from "../../../lib/format";
import { useConnectivity } from "../../../lib/use-connectivity";
import { useSites } from "../api/get-sites";

interface SiteListProps {
  campaignId: string;
  /** Link to a site's edit page, or null when the person may not edit. */
  editHrefOf: ((siteId: string) => string) | null;
}

function SiteRow({ site, editHref }: { site: SiteView; editHref: string | null }) {
  return (
    <tr className="border-t border-line align-top max-sm:flex max-sm:flex-wrap max-sm:items-start max-sm:py-2">
      <th scope="row" className="px-4 py-3 text-left font-normal max-sm:w-full max-sm:pb-1">
        <span className="block text-lg font-semibold">{site.name}</span>
        <span className="block text-sm text-muted">{siteKindLabels[site.kind]}</span>
        {site.notes !== "" && <span className="mt-1 block max-w-prose text-sm">{site.notes}</span>}
      </th>
      <td className="px-4 py-3 text-right whitespace-nowrap tabular-nums max-sm:py-1 max-sm:text-left">
        {formatLatitude(site.latitudeDeg)}
        <br />
        {formatLongitude(site.longitudeDeg)}
      </td>
      <td className="px-4 py-3 text-right whitespace-nowrap tabular-nums max-sm:py-1">
        <span className="text-sm text-muted sm:hidden">Approx. height </span>
        {formatHeightM(site.approxHeightM)}
      </td>
      <td className="hidden px-4 py-3 text-sm whitespace-nowrap tabular-nums lg:table-cell">
        {formatUtc(site.updatedAt)}
        <span className="block text-muted">{formatLocalBeside(site.updatedAt)}</span>
      </td>
      {editHref !== null && (
        <td className="px-4 py-2 text-right max-sm:ml-auto">
          <LinkButton to={editHref} aria-label={`Edit ${site.name}`}>
            Edit
          </LinkButton>
        </td>
      )}
    </tr>
  );
}

function OfflineCopyNotice({ loadedAtMs }: { loadedAtMs: number }) {
  const loadedAt = new Date(loadedAtMs).toISOString();
  return (
    <Notice tone="attention" title="Offline copy">
      Sites as loaded on <span className="tabular-nums">{formatUtc(loadedAt)}</span> (
      {formatLocalBeside(loadedAt)}). Adding and changing sites needs a connection for now.
    </Notice>
  );
}

interface SitesTableProps {
  sites: readonly SiteView[];
  editHrefOf: SiteListProps["editHrefOf"];
}

/** A table on tablets; on phones each row stacks into a card. */
function SitesTable({ sites, editHrefOf }: SitesTableProps) {
  return (
    <div className="relative overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse max-sm:block">
        <caption className="sr-only">Sites of this campaign</caption>
        <thead className="bg-sunken text-left text-sm max-sm:sr-only">
          <tr>
            <th scope="col" className="px-4 py-2">
              Site
            </th>
            <th scope="col" className="px-4 py-2 text-right">
              Position
            </th>
            <th scope="col" className="px-4 py-2 text-right whitespace-nowrap">
              Approx. height
            </th>
            <th scope="col" className="hidden px-4 py-2 lg:table-cell">
              Last changed
            </th>
            {editHrefOf !== null && (
              <th scope="col" className="px-4 py-2">
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody className="max-sm:block">
          {sites.map((site) => (
            <SiteRow key={site.id} site={site} editHref={editHrefOf?.(site.id) ?? null} />
          ))}
        </tbody>
      </table>
    </div>
  );
}

function NoDataYet({ error, paused }: { error: unknown; paused: boolean }) {
  if (error !== null) {
    return (
      <Notice tone="danger" title="Sites not loaded" live>
        {messageOf(error)}
      </Notice>
    );
  }
  if (paused) {
    return (
      <Notice tone="attention" title="Not yet on this device">
        The site list has not been loaded on this device yet. It appears once you are online.
      </Notice>
    );
  }
  return <Loading label="Loading sites…" />;
}

export function SiteList({ campaignId, editHrefOf }: SiteListProps) {
  const sites = useSites(campaignId);
  const online = useConnectivity() === "online";

  if (sites.data === undefined) {
    return <NoDataYet error={sites.error} paused={sites.fetchStatus === "paused"} />;
  }
  return (
    <div className="flex flex-col gap-4">
      {!online && <OfflineCopyNotice loadedAtMs={sites.dataUpdatedAt} />}
      {sites.isError && online && (
        <Notice tone="attention" title="Showing the saved list">
          Could not refresh: {messageOf(sites.error)}
        </Notice>
      )}
      {sites.data.length === 0 ? (
        <Notice title="No sites yet">This campaign has no sites yet.</Notice>
      ) : (
        <SitesTable sites={sites.data} editHrefOf={editHrefOf} />
      )}
    </div>
  );
}
