// A crate's legs with their steps; whoever travels with the crate records departure and arrival.
import { useState } from "react";
import { legState } from "../../../../shared/schemas/logistics";
import type { LocalLeg, LocalSite } from "../../../db/database";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import { messageOf } from "../../../lib/api-error";
import { useLogisticsWrites } from "../hooks/use-logistics";
import { LegStateWord } from "./status-word";
import { TimeText } from "../../../components/local-time-field";

interface Props {
  campaignId: string;
  legs: readonly LocalLeg[];
  sites: readonly LocalSite[];
  canRecord: boolean;
  canPlan: boolean;
  /** Legs the office approved: read-only until reopened. */
  approvedIds?: ReadonlySet<string>;
}

export function CrateLegs(props: Props) {
  const { campaignId, legs, sites, canRecord, canPlan, approvedIds } = props;
  const writes = useLogisticsWrites(campaignId);
  const [failure, setFailure] = useState<string | null>(null);
  const name = (id: string) => sites.find((s) => s.id === id)?.name ?? "a site not on this device";
  const run = (step: () => Promise<unknown>) => {
    setFailure(null);
    step().catch((error: unknown) => setFailure(messageOf(error)));
  };
  if (legs.length === 0) return <p className="text-muted">No legs planned for this crate.</p>;
  return (
    <div className="flex flex-col gap-3">
      <ul aria-label="Legs" className="flex flex-col gap-3">
        {legs.map((leg) => {
          const state = legState(leg);
          const route = `${name(leg.fromSiteId)} → ${name(leg.toSiteId)}`;
          const approved = approvedIds?.has(leg.id) ?? false;
          return (
            <li
              key={leg.id}
              className="flex flex-col gap-1 rounded-lg border-2 border-line bg-surface p-3"
            >
              <p className="flex flex-wrap items-center gap-x-3 text-lg font-semibold">
                <span>{route}</span>
                <LegStateWord state={state} />
                {leg.pending && <PendingMark />}
              </p>
              {leg.vehicle !== "" && <p>Vehicle: {leg.vehicle}</p>}
              <p className="text-sm">
                Planned: <TimeText iso={leg.plannedDepartAt} /> →{" "}
                <TimeText iso={leg.plannedArriveAt} />
              </p>
              {leg.departedAt !== null && (
                <p className="text-sm">
                  Departed: <TimeText iso={leg.departedAt} />
                </p>
              )}
              {leg.arrivedAt !== null && (
                <p className="text-sm">
                  Arrived: <TimeText iso={leg.arrivedAt} />
                </p>
              )}
              {leg.note !== "" && <p className="whitespace-pre-line text-sm">{leg.note}</p>}
              {approved && <p className="text-sm font-semibold">Approved by the office</p>}
              <div className="flex flex-wrap gap-3">
                {canRecord && !approved && state === "planned" && (
                  <Button
                    tone="primary"
                    onClick={() => run(() => writes.depart(leg.id))}
                    aria-label={`Depart ${route}`}
                  >
                    Depart
                  </Button>
                )}
                {canRecord && !approved && state === "under-way" && (
                  <Button
                    tone="primary"
                    onClick={() => run(() => writes.arrive(leg.id))}
                    aria-label={`Arrive ${route}`}
                  >
                    Arrive
                  </Button>
                )}
                {canPlan && !approved && state === "planned" && (
                  <Button
                    tone="danger"
                    onClick={() => run(() => writes.cancel(leg.id))}
                    aria-label={`Cancel leg ${route}`}
                  >
                    Cancel leg
                  </Button>
                )}
              </div>
            </li>
          );
        })}
      </ul>
      {failure !== null && (
        <Notice tone="danger" title="Not recorded" live>
          {failure}
        </Notice>
      )}
    </div>
  );
}
