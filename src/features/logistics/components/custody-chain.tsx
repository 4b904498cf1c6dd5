// The chain of custody of a crate, oldest first: who handed it to whom, when, where, in what state.
import { Link } from "react-router-dom";
import { handoverConditionLabels } from "../../../../shared/schemas/logistics";
import type { LocalHandover, LocalSite } from "../../../db/database";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { TimeText } from "../../../components/local-time-field";

interface Props {
  chain: readonly LocalHandover[];
  sites: readonly LocalSite[];
  photos: ReadonlyMap<string, number>;
  handoverHref: (handoverId: string) => string;
}

const conditionShape = { intact: "disc", marked: "triangle", damaged: "octagon" } as const;

export function CustodyChain({ chain, sites, photos, handoverHref }: Props) {
  if (chain.length === 0) return <p className="text-muted">No handover recorded yet.</p>;
  return (
    <ol aria-label="Chain of custody" className="flex flex-col gap-3">
      {chain.map((h, i) => {
        const site = sites.find((s) => s.id === h.siteId)?.name;
        const place = [site, h.place].filter((p) => p !== undefined && p !== "").join(", ");
        const count = photos.get(h.id) ?? 0;
        return (
          <li key={h.id} className="rounded-lg border-2 border-line bg-surface p-3">
            <p className="flex flex-wrap items-center gap-x-3 text-lg font-semibold">
              <span className="text-muted tabular-nums">{i + 1}.</span>
              <span>
                {h.fromName} → {h.toName}
              </span>
              {h.pending && <PendingMark />}
            </p>
            <p>
              <TimeText iso={h.at} />
              {place !== "" && <span> · {place}</span>}
            </p>
            <p className="flex items-center gap-2">
              <StatusShape shape={conditionShape[h.condition]} />
              {handoverConditionLabels[h.condition]}
            </p>
            <p className="text-sm text-muted">
              Signed by typed name: {h.toName}
              {h.recordedByName !== null && ` · recorded by ${h.recordedByName}`}
            </p>
            {h.note !== "" && <p className="whitespace-pre-line">{h.note}</p>}
            <Link to={handoverHref(h.id)} className="inline-flex min-h-touch items-center">
              {count === 0 ? "Add a photo of this handover" : `Photos (${count})`}
            </Link>
          </li>
        );
      })}
    </ol>
  );
}
