// Where handling a crate can hurt someone or break transport rules: say so, and defer to the rules
// that decide (local manual-handling rules, the carrier's dangerous-goods rules, the safety officer).
import type { CrateView } from "../../../../shared/schemas/crates";
import { Notice } from "../../../components/notice";
import { mentionsLithium, needsTeamLift, teamLiftKg } from "../format";

export function CrateCautions({ crate }: { crate: CrateView }) {
  const lift = needsTeamLift(crate);
  const lithium = mentionsLithium(crate);
  if (!lift && !lithium) return null;
  return (
    <div className="flex flex-col gap-3">
      {lift && (
        <Notice tone="attention" title={`Caution: team lift (${crate.weightKg} kg)`}>
          Over {teamLiftKg} kg: lift with two or more people or a lifting aid (common practice).
          Local manual-handling rules and the site&apos;s safety officer decide.
        </Notice>
      )}
      {lithium && (
        <Notice tone="attention" title="Caution: lithium batteries (dangerous goods)">
          Packing, labelling and carriage follow the carrier&apos;s dangerous-goods rules for
          lithium batteries; ask the carrier before booking, and the site&apos;s safety officer on
          site.
        </Notice>
      )}
    </div>
  );
}
