// Closing a section is final. Out of tolerance it asks why it is closed anyway (the server keeps
// the reason with the verdict); the store refuses without one.
import { useState } from "react";
import type { MisclosureCheck } from "../../../../shared/science/levelling/misclosure";
import { Button } from "../../../components/button";
import { TextAreaField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useLevellingWrites } from "../hooks/use-levelling";

interface CloseSectionProps {
  campaignId: string;
  sectionId: string;
  /** The saved setups' misclosure (what closing would record). */
  check: MisclosureCheck | null;
  hasDraft: boolean;
}

export function CloseSection({ campaignId, sectionId, check, hasDraft }: CloseSectionProps) {
  const writes = useLevellingWrites(campaignId);
  const [asking, setAsking] = useState(false);
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const out = check !== null && !check.withinTolerance;

  const close = () => {
    setError(null);
    writes.close(sectionId, note).catch((caught: unknown) => setError(messageOf(caught)));
  };

  return (
    <section
      aria-labelledby="close-section"
      className="flex flex-col gap-3 rounded-xl border-2 border-ink p-4"
    >
      <h2 id="close-section" className="text-xl font-semibold">
        Close the section
      </h2>
      {!asking ? (
        <div>
          <Button tone="primary" onClick={() => setAsking(true)}>
            Close section
          </Button>
        </div>
      ) : (
        <>
          {hasDraft && (
            <Notice tone="attention" title="A setup is typed but not saved">
              Closing records the saved setups only. Save or clear the typed setup first.
            </Notice>
          )}
          {out ? (
            <>
              <Notice tone="danger" title="Out of tolerance">
                The misclosure is beyond what the class allows. Re-levelling is the usual answer; to
                close anyway, say why.
              </Notice>
              <TextAreaField
                label="Reason for closing out of tolerance"
                value={note}
                maxLength={500}
                required
                onChange={(e) => setNote(e.target.value)}
              />
            </>
          ) : (
            <>
              <p>Closing is final: the section takes no more setups.</p>
              <TextAreaField
                label="Note (optional)"
                value={note}
                maxLength={500}
                onChange={(e) => setNote(e.target.value)}
              />
            </>
          )}
          <div className="flex flex-wrap gap-3">
            <Button tone={out ? "danger" : "primary"} onClick={close}>
              {out ? "Close anyway" : "Close now"}
            </Button>
            <Button onClick={() => setAsking(false)}>Cancel</Button>
          </div>
        </>
      )}
      {error !== null && (
        <Notice tone="danger" title="Not closed" live>
          {error}
        </Notice>
      )}
    </section>
  );
}
