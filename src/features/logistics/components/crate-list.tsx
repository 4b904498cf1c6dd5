// The campaign's crates: label, contents, state, limits, and where each one is by its legs.
import { Link } from "react-router-dom";
import type { CrateView } from "../../../../shared/schemas/crates";
import type { LocalLeg, LocalSite } from "../../../db/database";
import { cratePlace, shownCrateState } from "../../../db/logistics-queries";
import { StatusShape } from "../../../components/status-shape";
import { needsTeamLift } from "../format";
import { CrateLimits } from "./crate-limits";
import { describePlace } from "./crate-place";
import { CrateStateWord } from "./status-word";

interface Props {
  crates: readonly CrateView[];
  legs: readonly LocalLeg[];
  sites: readonly LocalSite[];
  crateHref: (crateId: string) => string;
}

export function CrateList({ crates, legs, sites, crateHref }: Props) {
  if (crates.length === 0)
    return (
      <p className="text-muted">No crates on this device yet. They arrive with the next sync.</p>
    );
  const siteName = (id: string) =>
    sites.find((s) => s.id === id)?.name ?? "a site not on this device";
  return (
    <ul aria-label="Crates" className="grid gap-3 md:grid-cols-2">
      {crates.map((crate) => {
        const crateLegs = legs.filter((l) => l.crateId === crate.id);
        const place = cratePlace(crateLegs);
        return (
          <li
            key={crate.id}
            className="flex flex-col gap-1 rounded-xl border-2 border-line bg-surface p-4"
          >
            <Link
              to={crateHref(crate.id)}
              className="inline-flex min-h-touch items-center text-xl font-semibold"
            >
              {crate.label}
            </Link>
            <span>{crate.contents}</span>
            <CrateStateWord state={shownCrateState(crate, crateLegs)} />
            <span className="flex items-center gap-2">
              <StatusShape
                shape={place.kind === "moving" ? "dots" : "disc"}
                className="text-muted"
              />
              {describePlace(place, siteName)}
            </span>
            <span className="text-sm text-muted">
              <CrateLimits crate={crate} />
            </span>
            {needsTeamLift(crate) && (
              <span className="flex items-center gap-2 text-sm text-attention-ink">
                <StatusShape shape="triangle" className="text-attention" />
                Team lift
              </span>
            )}
          </li>
        );
      })}
    </ul>
  );
}
