// The map's points as a list: the way to read them without seeing the map.
import { Link } from "react-router-dom";
import { formatLatitude, formatLongitude } from "../../lib/format";
import type { MapPoint, MapPointKind } from "./map-data";
import { mapPointKindLabels } from "./map-data";
import { PointMark } from "./map-legend";

interface Props {
  points: readonly MapPoint[];
  /** Where a point's name links to, if anywhere. */
  hrefOf: (point: MapPoint) => string | undefined;
}

const groups: { kind: MapPointKind; title: string; empty: string }[] = [
  { kind: "site", title: "Sites", empty: "No sites on this device yet." },
  { kind: "benchmark", title: "Benchmarks", empty: "No benchmarks known on this device." },
  {
    kind: "crate",
    title: "Crates",
    empty: "No crate has an entry or an arrival yet, so none has a known position.",
  },
];

export function MapPointsList({ points, hrefOf }: Props) {
  return (
    <div className="flex flex-col gap-5">
      {groups.map((group) => {
        const mine = points.filter((p) => p.kind === group.kind);
        return (
          <section key={group.kind} aria-labelledby={`map-list-${group.kind}`}>
            <h2 id={`map-list-${group.kind}`} className="mb-2 text-xl font-semibold">
              {group.title}
            </h2>
            {mine.length === 0 ? (
              <p className="text-muted">{group.empty}</p>
            ) : (
              <ul aria-label={group.title} className="flex flex-col gap-2">
                {mine.map((point) => {
                  const href = hrefOf(point);
                  return (
                    <li
                      key={`${point.kind}-${point.id}`}
                      className="flex items-start gap-3 rounded-lg border-2 border-line bg-surface p-3"
                    >
                      <PointMark kind={point.kind} />
                      <span className="flex min-w-0 flex-col">
                        <span className="font-semibold">
                          {href === undefined ? (
                            point.name
                          ) : (
                            <Link to={href} className="inline-flex min-h-touch items-center">
                              {point.name}
                            </Link>
                          )}
                          <span className="sr-only"> ({mapPointKindLabels[point.kind]})</span>
                        </span>
                        <span className="text-sm text-muted">{point.detail}</span>
                        <span className="text-sm text-muted tabular-nums">
                          {formatLatitude(point.latitudeDeg)}, {formatLongitude(point.longitudeDeg)}
                        </span>
                      </span>
                    </li>
                  );
                })}
              </ul>
            )}
          </section>
        );
      })}
    </div>
  );
}
