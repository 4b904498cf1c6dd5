// Scans a label and says which crate it names: the quick check that the label on the crate and
// the one printed agree, and the way to reach another crate's label.
import { useState } from "react";
import { Link } from "react-router-dom";
import type { CrateView } from "../../../shared/schemas/crates";
import { StatusShape } from "../../components/status-shape";
import { LabelScanner } from "./label-scanner";

interface Props {
  current: CrateView;
  crates: readonly CrateView[];
  labelHref: (crateId: string) => string;
}

export function LabelCheck({ current, crates, labelHref }: Props) {
  const [read, setRead] = useState<string | null>(null);
  const match = read === null ? undefined : crates.find((c) => c.label === read);
  return (
    <section aria-labelledby="label-check-title" className="flex flex-col gap-3">
      <h2 id="label-check-title" className="text-xl font-semibold">
        Check a label
      </h2>
      <LabelScanner onLabel={setRead} />
      {read !== null && (
        <p role="status" className="flex items-center gap-2 text-lg">
          {match?.id === current.id ? (
            <>
              <StatusShape shape="disc" className="text-primary" />
              <span>
                Read <strong>{read}</strong>: this crate.
              </span>
            </>
          ) : match !== undefined ? (
            <>
              <StatusShape shape="triangle" className="text-attention" />
              <span>
                Read <strong>{read}</strong>: another crate ({match.contents}).{" "}
                <Link to={labelHref(match.id)}>Open its label</Link>
              </span>
            </>
          ) : (
            <>
              <StatusShape shape="octagon" className="text-danger" />
              <span>
                Read <strong>{read}</strong>: no crate of this campaign has this label on this
                device.
              </span>
            </>
          )}
        </p>
      )}
    </section>
  );
}
