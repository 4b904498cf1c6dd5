// An unpacking checklist is signed off only after a dew-point check for it passed, or was
// overridden with a reason: this panel says which, and leads to the check.
import { dewPointClears } from "../../../../shared/field-entries";
import type { LocalFieldEntry } from "../../../db/database";
import { LinkButton } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { EntryList } from "./entry-list";
import type { CrateView } from "../../../../shared/schemas/crates";

interface Props {
  runId: string;
  entries: readonly LocalFieldEntry[];
  crates: readonly CrateView[];
  checkHref: string | null;
  entryHref: (id: string) => string;
}

export function DewPointGate({ runId, entries, crates, checkHref, entryHref }: Props) {
  const checks = entries.filter((e) => e.data.kind === "dew-point" && e.data.runId === runId);
  const cleared = checks.some((e) => e.data.kind === "dew-point" && dewPointClears(e.data));
  return (
    <section
      aria-label="Dew-point check"
      className="flex flex-col gap-3 rounded-xl border-2 border-ink p-4"
    >
      <h2 className="text-lg font-semibold">Dew-point check before unpacking</h2>
      {cleared ? (
        <Notice title="Check done">
          The crate may be opened: this checklist can be signed off.
        </Notice>
      ) : (
        <Notice tone="attention" title="Check needed">
          Measure the room and the crate&apos;s coldest surface. Sign-off waits until the check
          passes, or until a reason to open anyway is given.
        </Notice>
      )}
      {checks.length > 0 && (
        <EntryList
          label="Dew-point checks"
          entries={checks}
          crates={crates}
          entryHref={entryHref}
          empty=""
        />
      )}
      {checkHref !== null && (
        <div>
          <LinkButton tone={cleared ? "secondary" : "primary"} to={checkHref}>
            {checks.length === 0 ? "Do the dew-point check" : "Check again"}
          </LinkButton>
        </div>
      )}
    </section>
  );
}
