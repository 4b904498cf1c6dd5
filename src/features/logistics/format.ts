// Words and shapes for logistics, and the cautions a crate calls for.
import type { CrateView } from "../../../shared/schemas/crates";
import type { CrateState, LegState } from "../../../shared/schemas/logistics";
import type { StatusShapeName } from "../../components/status-shape";

export const crateStateShapes: Record<CrateState, { shape: StatusShapeName; tone: string }> = {
  ready: { shape: "disc", tone: "text-primary" },
  moving: { shape: "dots", tone: "text-ink" },
  arrived: { shape: "disc", tone: "text-primary" },
  unpacked: { shape: "disc", tone: "text-primary" },
  returned: { shape: "disc", tone: "text-primary" },
  held: { shape: "octagon", tone: "text-danger" },
};

export const legStateWords: Record<LegState, { word: string; shape: StatusShapeName }> = {
  planned: { word: "Planned", shape: "ring" },
  "under-way": { word: "On the way", shape: "dots" },
  arrived: { word: "Arrived", shape: "disc" },
  cancelled: { word: "Cancelled", shape: "octagon" },
};

// Above this a crate is a team lift in most manual-handling guidance (common practice; local rules decide).
export const teamLiftKg = 25;

export const needsTeamLift = (crate: Pick<CrateView, "weightKg">) => crate.weightKg > teamLiftKg;

/** Contents or notes naming lithium batteries: dangerous goods in transport. */
export const mentionsLithium = (crate: Pick<CrateView, "contents" | "notes">) =>
  /lithium|li-ion|li-po|\blipo\b/i.test(`${crate.contents} ${crate.notes}`);
