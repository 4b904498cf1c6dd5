import { siteKindLabels } from "../../../../shared/schemas";
import type { LocalSite } from "../../../db/database";
import { Link } from "react-router-dom";
import { LinkButton } from "../../../components/button";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import {
  formatHeightM,
  formatLatitude,
  formatLocalBeside,
  formatLongitude,
  formatUtc,
} from "../../../lib/format";
import { useConnectivity } from "../../../lib/use-connectivity";
import { useSyncStatus } from "../../../lib/sync-context";
import { useLocalSites } from "../hooks/use-local-sites";

interface SiteListProps {
  campaignId: string;
  /** Link to a site's edit page, or null when the person may not edit. */
  editHrefOf: ((siteId: string) => string) | null;
  /** Link to a site's board. */
  boardHrefOf: (siteId: string) => string;
}

interface SiteRowProps {
  site: LocalSite;
  editHref: string | null;
  boardHref: string;
}

function SiteRow({ site, editHref, boardHref }: SiteRowProps) {
  return (
    <tr className="border-t border-line align-top max-sm:flex max-sm:flex-wrap max-sm:items-start max-sm:py-2">
      <th scope="row" className="px-4 py-3 text-left font-normal max-sm:w-full max-sm:pb-1">
        <Link to={boardHref} className="inline-flex min-h-touch items-center text-lg font-semibold">
          {site.name}
        </Link>
        <span className="block text-sm text-muted">{siteKindLabels[site.kind]}</span>
        {site.pendingChanges > 0 && <PendingMark className="mt-1" />}
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

interface SitesTableProps {
  sites: readonly LocalSite[];
  editHrefOf: SiteListProps["editHrefOf"];
  boardHrefOf: SiteListProps["boardHrefOf"];
}

/** A table on tablets; on phones each row stacks into a card. */
function SitesTable({ sites, editHrefOf, boardHrefOf }: SitesTableProps) {
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
            <SiteRow
              key={site.id}
              site={site}
              editHref={editHrefOf?.(site.id) ?? null}
              boardHref={boardHrefOf(site.id)}
            />
          ))}
        </tbody>
      </table>
    </div>
  );
}

function NotOnDeviceYet({ online, error }: { online: boolean; error: string | null }) {
  if (!online) {
    return (
      <Notice tone="attention" title="Nothing on this device yet">
        This campaign has not been loaded onto this device. Connect to the network once and its
        sites come here, to use offline afterwards.
      </Notice>
    );
  }
  if (error !== null) {
    return (
      <Notice tone="danger" title="Campaign not loaded" live>
        {error}
      </Notice>
    );
  }
  return <Loading label="Loading the campaign onto this device…" />;
}

export function SiteList({ campaignId, editHrefOf, boardHrefOf }: SiteListProps) {
  const { sites, pulled } = useLocalSites(campaignId);
  const online = useConnectivity() === "online";
  const syncError = useSyncStatus().error;

  if (sites === undefined || pulled === undefined) return <Loading label="Reading this device…" />;
  return (
    <div className="flex flex-col gap-4">
      {!pulled && <NotOnDeviceYet online={online} error={syncError?.message ?? null} />}
      {pulled && sites.length === 0 && (
        <Notice title="No sites yet">This campaign has no sites yet.</Notice>
      )}
      {sites.length > 0 && (
        <SitesTable sites={sites} editHrefOf={editHrefOf} boardHrefOf={boardHrefOf} />
      )}
    </div>
  );
}
