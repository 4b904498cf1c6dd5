// A site's levelling sections: marks, class, open or closed, the misclosure against the tolerance
// when both runs have setups, and whether this device still has changes to send.
import {
  describeMisclosure,
  summariseSection,
  type BookSetup,
} from "../../../../shared/levelling-book";
import {
  findLevellingClass,
  type MisclosureCheck,
} from "../../../../shared/science/levelling/misclosure";
import type { LocalLevellingSection } from "../../../db/database";
import { LinkButton } from "../../../components/button";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape, type StatusShapeName } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useSiteSections } from "../hooks/use-levelling";

function checkOf(section: LocalLevellingSection, setups: BookSetup[]): MisclosureCheck | null {
  const c = section.closure;
  if (c !== null) return { ...c, usedFraction: Math.abs(c.misclosureM) / c.toleranceM };
  return summariseSection(section.classId, setups).misclosure;
}

function stateOf(section: LocalLevellingSection, check: MisclosureCheck | null) {
  const out = check !== null && !check.withinTolerance;
  const shape: StatusShapeName = out ? "octagon" : section.closedAt === null ? "dots" : "disc";
  const word = `${section.closedAt === null ? "Open" : "Closed"}${out ? ", out of tolerance" : ""}`;
  return { shape, word, tint: out ? "text-danger" : "text-primary" };
}

interface SiteSectionsProps {
  campaignId: string;
  siteId: string;
  sectionHref: (sectionId: string) => string;
}

export function SiteSections({ campaignId, siteId, sectionHref }: SiteSectionsProps) {
  const data = useSiteSections(campaignId, siteId);
  if (data === undefined) return <p className="text-muted">Reading the sections…</p>;
  if (data.sections.length === 0)
    return <p className="text-muted">No section has been levelled at this site yet.</p>;
  return (
    <ul aria-label="Levelling sections at this site" className="flex flex-col gap-3">
      {data.sections.map((section) => {
        const levellingClass = findLevellingClass(section.classId);
        const check = checkOf(section, data.setups.get(section.id) ?? []);
        const state = stateOf(section, check);
        const count = data.setups.get(section.id)?.length ?? 0;
        return (
          <li
            key={section.id}
            className="flex flex-col gap-2 rounded-xl border-2 border-line bg-surface p-4"
          >
            <div className="flex flex-wrap items-center gap-3">
              <span className="inline-flex items-center gap-2 font-semibold">
                <StatusShape shape={state.shape} className={state.tint} />
                {state.word}
              </span>
              <span className="text-lg font-semibold">
                {section.fromMark} → {section.toMark}
              </span>
              {section.pending && <PendingMark />}
              <LinkButton
                className="ml-auto"
                to={sectionHref(section.id)}
                aria-label={`Field book ${section.fromMark} → ${section.toMark}`}
              >
                {section.closedAt === null ? "Continue" : "Open"}
              </LinkButton>
            </div>
            <p className="text-muted tabular-nums">
              {levellingClass.name}
              {section.instrument !== "" && ` · ${section.instrument}`} · opened{" "}
              {formatUtc(section.openedAt)} ({formatLocalBeside(section.openedAt)}) · {count}{" "}
              {count === 1 ? "setup" : "setups"}
            </p>
            {check !== null && (
              <p className="tabular-nums">{describeMisclosure(check, levellingClass)}</p>
            )}
          </li>
        );
      })}
    </ul>
  );
}
