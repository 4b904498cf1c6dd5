// The field book of a section: the live misclosure, each run's setups with an entry row, and the
// close. Figures include the setup being typed, so a bad reading shows before it is saved.
import { useRef, useState } from "react";
import {
  currentSetups,
  describeMisclosure,
  setupWarnings,
  summariseSection,
  type BookSetup,
} from "../../../../shared/levelling-book";
import { findLevellingClass } from "../../../../shared/science/levelling/misclosure";
import { runningReduction } from "../../../../shared/science/levelling/running";
import type { LevellingRun } from "../../../../shared/schemas/levelling";
import type { LocalLevellingSection, LocalLevellingSetup } from "../../../db/database";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import {
  draftSetup,
  emptyEntry,
  entriesWithDraft,
  entryFrom,
  parseEntry,
  type EntryText,
} from "../entry-draft";
import { MisclosurePanel } from "./misclosure-panel";
import { CloseSection } from "./close-section";
import { RunTable, WarningLines } from "./run-table";
import { SetupEntry } from "./setup-entry";

interface FieldBookProps {
  campaignId: string;
  section: LocalLevellingSection;
  setups: readonly LocalLevellingSetup[];
  canRecord: boolean;
}

const runs = ["forward", "backward"] as const;

function correctedIn(setups: readonly LocalLevellingSetup[], run: LevellingRun): Set<number> {
  const seen = new Set<number>();
  const twice = new Set<number>();
  for (const s of setups) {
    if (s.run !== run) continue;
    if (seen.has(s.number)) twice.add(s.number);
    seen.add(s.number);
  }
  return twice;
}

export function FieldBook({ campaignId, section, setups, canRecord }: FieldBookProps) {
  const [texts, setTexts] = useState<Record<LevellingRun, EntryText>>({
    forward: emptyEntry,
    backward: emptyEntry,
  });
  const entryRefs = useRef<Record<LevellingRun, HTMLDivElement | null>>({
    forward: null,
    backward: null,
  });
  const levellingClass = findLevellingClass(section.classId);
  const open = section.closedAt === null;
  const writable = open && canRecord;
  const current: Record<LevellingRun, LocalLevellingSetup[]> = currentSetups(setups);
  const saved = summariseSection(section.classId, setups);
  const runName = (run: LevellingRun) =>
    run === "forward"
      ? `Forward run, ${section.fromMark} → ${section.toMark}`
      : `Backward run, ${section.toMark} → ${section.fromMark}`;

  const next = (run: LevellingRun) => Math.max(0, ...current[run].map((s) => s.number)) + 1;
  const parsed = {
    forward: parseEntry(texts.forward, next("forward")),
    backward: parseEntry(texts.backward, next("backward")),
  };
  const drafts: BookSetup[] = writable
    ? runs.filter((r) => parsed[r].complete).map((r) => draftSetup(r, parsed[r]))
    : [];
  const live =
    drafts.length > 0 ? summariseSection(section.classId, [...setups, ...drafts]) : saved;
  const hasDraft = runs.some((r) => parsed[r].started);

  const correct = (setup: LocalLevellingSetup) => {
    setTexts((all) => ({ ...all, [setup.run]: entryFrom(setup) }));
    const box = entryRefs.current[setup.run];
    box?.scrollIntoView({ block: "center" });
    box?.querySelectorAll("input")[1]?.focus();
  };

  const pending = setups.filter((s) => s.pending).length;

  return (
    <div className="flex flex-col gap-6">
      {open ? (
        <MisclosurePanel
          check={live.misclosure}
          levellingClass={levellingClass}
          includesDraft={drafts.length > 0}
        />
      ) : (
        <ClosedNotice section={section} />
      )}
      {pending > 0 && (
        <p className="flex items-center gap-2 font-semibold">
          <StatusShape shape="dots" />
          {pending === 1 ? "1 setup" : `${pending} setups`} not yet sent
        </p>
      )}
      {runs.map((run) => {
        const reduction = saved[run];
        const { entries, draftIndex } = entriesWithDraft(current[run], parsed[run]);
        const preview = parsed[run].started
          ? runningReduction(entries).rows[draftIndex]
          : undefined;
        const runWarnings = saved.warnings.filter((w) => w.run === run);
        return (
          <section key={run} aria-labelledby={`run-${run}`} className="flex flex-col gap-3">
            <h2 id={`run-${run}`} className="text-xl font-semibold">
              {runName(run)}
            </h2>
            <RunTable
              caption={`Setups of the ${runName(run)}`}
              setups={current[run]}
              reduction={reduction}
              warnings={runWarnings}
              corrected={correctedIn(setups, run)}
              onCorrect={writable ? correct : null}
            />
            <p className="tabular-nums text-muted">
              {reduction.completeSetups === 1 ? "1 setup" : `${reduction.completeSetups} setups`} ·{" "}
              {(reduction.lengthKm * 1000).toFixed(1)} m of sights
            </p>
            {runWarnings.some((w) => w.setupId === "") && (
              <WarningLines warnings={runWarnings.filter((w) => w.setupId === "")} />
            )}
            {writable && (
              <div
                ref={(el) => {
                  entryRefs.current[run] = el;
                }}
              >
                <SetupEntry
                  campaignId={campaignId}
                  sectionId={section.id}
                  run={run}
                  runName={runName(run)}
                  text={texts[run]}
                  onText={(text) => setTexts((all) => ({ ...all, [run]: text }))}
                  parsed={parsed[run]}
                  nextNumber={next(run)}
                  preview={preview}
                  misclosure={
                    live.misclosure === null
                      ? null
                      : {
                          text: describeMisclosure(live.misclosure, levellingClass),
                          within: live.misclosure.withinTolerance,
                        }
                  }
                  warnings={parsed[run].started ? setupWarnings(draftSetup(run, parsed[run])) : []}
                />
              </div>
            )}
          </section>
        );
      })}
      {writable && (
        <CloseSection
          campaignId={campaignId}
          sectionId={section.id}
          check={saved.misclosure}
          hasDraft={hasDraft}
        />
      )}
    </div>
  );
}

function ClosedNotice({ section }: { section: LocalLevellingSection }) {
  const c = section.closure;
  const levellingClass = findLevellingClass(section.classId);
  const when = section.closedAt ?? "";
  return (
    <Notice
      tone={c !== null && !c.withinTolerance ? "danger" : "info"}
      title={c !== null && !c.withinTolerance ? "Closed out of tolerance" : "Closed"}
    >
      <p className="tabular-nums">
        {formatUtc(when)} ({formatLocalBeside(when)})
      </p>
      {c !== null && (
        <p className="tabular-nums">
          {describeMisclosure(
            {
              misclosureM: c.misclosureM,
              toleranceM: c.toleranceM,
              lengthKm: c.lengthKm,
              withinTolerance: c.withinTolerance,
              usedFraction: Math.abs(c.misclosureM) / c.toleranceM,
            },
            levellingClass,
          )}
        </p>
      )}
      {section.closeNote !== "" && <p>Reason: {section.closeNote}</p>}
    </Notice>
  );
}
