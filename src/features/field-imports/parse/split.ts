// Readings to entry drafts: at most samplesMax / eventsMax per entry, the parts of one file sharing
// one import id so they are shown (and can be found) as one import.
import { fieldEntryLimits, type FieldEntryInput } from "../../../../shared/schemas/field-entries";
import type { Readings } from "./parse-csv";

/** What the local store takes: an entry without its id and recording time. */
export type ImportDraft = Omit<FieldEntryInput, "id" | "recordedAt">;

export interface ImportTarget {
  siteId: string;
  crateId: string;
  loggerModel: string;
  fileName: string;
  note?: string;
}

function chunks<T>(items: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

export function splitIntoDrafts(
  readings: Readings,
  target: ImportTarget,
  importId: string = crypto.randomUUID(),
): ImportDraft[] {
  const base = { siteId: target.siteId, crateId: target.crateId, note: target.note ?? "" };
  const loggerModel = target.loggerModel.trim();
  const fileName = target.fileName.slice(0, 200);
  const importOf = (part: number, parts: number) => ({ importId, fileName, part, parts });
  if (readings.kind === "temperatures") {
    const parts = chunks(readings.samples, fieldEntryLimits.samplesMax);
    return parts.map((samples, i) => ({
      ...base,
      observedAt: samples[0]?.at ?? "",
      data: {
        kind: "temperatures",
        source: "logger",
        loggerModel,
        import: importOf(i + 1, parts.length),
        samples,
      },
    }));
  }
  // Shock events keep the file's order; a part's time is its earliest event.
  const parts = chunks(readings.events, fieldEntryLimits.eventsMax);
  return parts.map((events, i) => ({
    ...base,
    observedAt: events.map((e) => e.at).sort()[0] ?? "",
    data: {
      kind: "shock-log",
      source: "logger",
      loggerModel,
      import: importOf(i + 1, parts.length),
      events,
    },
  }));
}
