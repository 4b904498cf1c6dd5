// Per crate: where it travelled, what went beyond its limits, custody changes and open alerts.
import { StatusShape } from "../../../components/status-shape";
import { formatUtc } from "../../../lib/format";
import type { CrateTransport, TravelledLeg } from "../lib/transport-summary";

const celsius = (v: number) => `${v.toFixed(1).replace("-", "−")} °C`;
const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

function LegsTable({ legs, label }: { legs: readonly TravelledLeg[]; label: string }) {
  return (
    <table className="w-full border-collapse text-sm tabular-nums">
      <caption className="sr-only">Legs of {label}</caption>
      <thead>
        <tr className="border-b border-ink text-left">
          <th scope="col" className="px-2 py-1">
            From → to
          </th>
          <th scope="col" className="px-2 py-1">
            Departed
          </th>
          <th scope="col" className="px-2 py-1">
            Arrived
          </th>
        </tr>
      </thead>
      <tbody>
        {legs.map((l) => (
          <tr key={l.id} className="border-b border-line">
            <td className="px-2 py-1">
              {l.fromName} → {l.toName}
            </td>
            <td className="px-2 py-1">{l.departedAt === null ? "—" : formatUtc(l.departedAt)}</td>
            <td className="px-2 py-1">
              {l.arrivedAt === null ? "on the way" : formatUtc(l.arrivedAt)}
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}

function CrateCard({ item }: { item: CrateTransport }) {
  const { crate, legs, excursions, openAlerts } = item;
  return (
    <div
      data-report-keep=""
      data-testid={`transport-${crate.label}`}
      className="flex flex-col gap-2 border-t-2 border-ink pt-3"
    >
      <h3 className="text-lg font-semibold">
        {crate.label} <span className="font-normal text-muted">· {crate.contents}</span>
      </h3>
      <p className="text-sm tabular-nums">
        Limits: {crate.maxShockG} g, {celsius(crate.temperatureMinC)} …{" "}
        {celsius(crate.temperatureMaxC)}. {plural(item.handovers, "handover", "handovers")}
        {item.plannedLegs > 0 && `, ${plural(item.plannedLegs, "leg", "legs")} still planned`}.
      </p>
      {legs.length === 0 ? (
        <p className="text-sm text-muted">No leg travelled yet.</p>
      ) : (
        <LegsTable legs={legs} label={crate.label} />
      )}
      {excursions.length === 0 ? (
        <p className="flex items-center gap-2 text-sm">
          <StatusShape shape="disc" /> No shock or temperature beyond the limits recorded.
        </p>
      ) : (
        <ul
          className="flex flex-col gap-1 text-sm"
          aria-label={`Beyond the limits: ${crate.label}`}
        >
          {excursions.map((e) => (
            <li key={e.id} className="flex gap-2">
              <StatusShape shape="octagon" className="mt-0.5" />
              <span>
                <span className="font-semibold">
                  {e.kind === "shock" ? "Shock" : "Temperature"}
                </span>{" "}
                {formatUtc(e.observedAt)} at {e.siteName}: {e.summary}
              </span>
            </li>
          ))}
        </ul>
      )}
      <p className="flex items-center gap-2 text-sm">
        <StatusShape shape={openAlerts.length === 0 ? "disc" : "triangle"} />
        {openAlerts.length === 0
          ? "No open alerts."
          : `${plural(openAlerts.length, "open alert", "open alerts")}: ${openAlerts.map((a) => a.summary).join("; ")}`}
      </p>
    </div>
  );
}

export function TransportSummaryList({ crates }: { crates: readonly CrateTransport[] }) {
  if (crates.length === 0) return <p className="text-muted">No crates on this device.</p>;
  return (
    <div className="flex flex-col gap-4">
      {crates.map((item) => (
        <CrateCard key={item.crate.id} item={item} />
      ))}
    </div>
  );
}
