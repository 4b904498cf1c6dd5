// The campaign's sites as a table: name, kind, position and approximate height, with units.
import { siteKindLabels, type SiteView } from "../../../../shared/schemas/sites";
import { formatHeightM, formatLatitude, formatLongitude } from "../../../lib/format";

type SiteRow = Pick<
  SiteView,
  "id" | "name" | "kind" | "latitudeDeg" | "longitudeDeg" | "approxHeightM"
>;

const cell = "px-2 py-1.5 text-right tabular-nums";

export function SitesTable({ sites }: { sites: readonly SiteRow[] }) {
  if (sites.length === 0) return <p className="text-muted">No sites on this device.</p>;
  return (
    <table data-report-keep="" className="w-full border-collapse text-sm">
      <caption className="sr-only">Sites</caption>
      <thead>
        <tr className="border-b-2 border-ink text-left">
          <th scope="col" className="px-2 py-1.5">
            Site
          </th>
          <th scope="col" className="px-2 py-1.5">
            Kind
          </th>
          <th scope="col" className="px-2 py-1.5 text-right">
            Latitude
          </th>
          <th scope="col" className="px-2 py-1.5 text-right">
            Longitude
          </th>
          <th scope="col" className="px-2 py-1.5 text-right">
            Approx. height
          </th>
        </tr>
      </thead>
      <tbody>
        {sites.map((s) => (
          <tr key={s.id} className="border-b border-line">
            <th scope="row" className="px-2 py-1.5 text-left font-semibold">
              {s.name}
            </th>
            <td className="px-2 py-1.5">{siteKindLabels[s.kind]}</td>
            <td className={cell}>{formatLatitude(s.latitudeDeg)}</td>
            <td className={cell}>{formatLongitude(s.longitudeDeg)}</td>
            <td className={cell}>{formatHeightM(s.approxHeightM)}</td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
