// The crates at a site — placed here by their last arrived leg, or, for a crate no leg has placed
// yet, seen here in an entry — each with its limits and whether anything recorded for it went
// beyond them.
import type { CrateView } from "../../../../shared/schemas/crates";
import type { LocalFieldEntry } from "../../../db/database";
import { StatusShape } from "../../../components/status-shape";

// Above this a crate is a team lift in most manual-handling guidance (common practice; local rules decide).
const teamLiftKg = 25;

interface Props {
  entries: readonly LocalFieldEntry[];
  crates: readonly CrateView[];
  /** Where the legs put each crate: "here", "elsewhere", or absent when no leg has placed it. */
  placed: ReadonlyMap<string, "here" | "elsewhere">;
}

export function CratesOnSite({ entries, crates, placed }: Props) {
  const seen = crates.filter((c) =>
    placed.has(c.id) ? placed.get(c.id) === "here" : entries.some((e) => e.crateId === c.id),
  );
  if (seen.length === 0)
    return (
      <p className="text-muted">No crate here yet. Read each crate's indicators on arrival.</p>
    );
  return (
    <ul aria-label="Crates at this site" className="flex flex-col gap-2">
      {seen.map((crate) => {
        const mine = entries.filter((e) => e.crateId === crate.id);
        const exceeded = mine.filter((e) => e.flags.exceeded).length;
        return (
          <li
            key={crate.id}
            className="flex flex-col gap-1 rounded-lg border-2 border-line bg-surface p-3"
          >
            <span className="flex flex-wrap items-center gap-x-3">
              <span className="text-lg font-semibold">{crate.label}</span>
              <span className="text-muted">{crate.contents}</span>
            </span>
            <span className="text-sm text-muted tabular-nums">
              Limits: {crate.maxShockG} g, {crate.temperatureMinC} … {crate.temperatureMaxC} °C ·{" "}
              {crate.weightKg} kg
            </span>
            {crate.weightKg > teamLiftKg && (
              <span className="flex items-start gap-2 text-attention-ink">
                <StatusShape shape="triangle" className="mt-0.5 text-attention" />
                Caution: team lift ({crate.weightKg} kg). Follow local manual-handling rules and the
                site&apos;s safety officer.
              </span>
            )}
            {exceeded > 0 ? (
              <span className="flex items-center gap-2 font-semibold text-danger-ink">
                <StatusShape shape="octagon" className="text-danger" />
                {exceeded === 1
                  ? "1 entry beyond its limits"
                  : `${exceeded} entries beyond its limits`}
              </span>
            ) : (
              <span className="flex items-center gap-2">
                <StatusShape shape="disc" className="text-primary" />
                Within its limits ({mine.length === 1 ? "1 entry" : `${mine.length} entries`})
              </span>
            )}
          </li>
        );
      })}
    </ul>
  );
}
