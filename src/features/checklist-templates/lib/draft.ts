// The editor's working copy of a template: numbers and options as typed, turned into the shared
// schema's input only when checked or saved.
import type { z } from "zod";
import {
  checklistTemplateFields,
  type ChecklistTemplateCreateInput,
} from "../../../../shared/schemas/checklist-templates";
import type {
  ChecklistItem,
  ChecklistItemKind,
  ChecklistPurpose,
  ChecklistTemplateView,
  HazardKind,
  checklistItem,
} from "../../../../shared/schemas/checklists";
import { parseDecimal } from "../../../lib/format";
import { assignItemIds } from "./item-ids";

export interface DraftItem {
  /** React's key: stable while items move. */
  key: string;
  /** The saved id, kept when the label changes; null until the item is first saved. */
  id: string | null;
  kind: ChecklistItemKind;
  label: string;
  help: string;
  required: boolean;
  hasCaution: boolean;
  hazard: HazardKind;
  cautionText: string;
  unit: string;
  min: string;
  max: string;
  /** One option per line. */
  options: string;
}

export interface Draft {
  title: string;
  purpose: ChecklistPurpose;
  items: DraftItem[];
}

/** Messages by field path as the server names them, e.g. "items.2.max". */
export type FieldErrors = Record<string, string>;

export const purposeLabels: Record<ChecklistPurpose, string> = {
  arrival: "Arrival at a site",
  unpacking: "Unpacking",
  "vacuum-bakeout": "Vacuum bake-out",
  "laser-lockup": "Laser lock-up",
  "comparison-start": "Start of a comparison",
  "pack-down": "Packing down",
  other: "Other",
};

export const kindLabels: Record<ChecklistItemKind, string> = {
  check: "Tick box",
  number: "Number with unit",
  text: "Text",
  choice: "Choice",
  photo: "Photo",
};

let keyCounter = 0;
const nextKey = () => `item-${(keyCounter += 1)}`;

export function emptyItem(): DraftItem {
  return {
    key: nextKey(),
    id: null,
    kind: "check",
    label: "",
    help: "",
    required: true,
    hasCaution: false,
    hazard: "lifting",
    cautionText: "",
    unit: "",
    min: "",
    max: "",
    options: "",
  };
}

const numberText = (value: number | null) => (value === null ? "" : String(value));

function draftItem(item: ChecklistItem): DraftItem {
  return {
    ...emptyItem(),
    id: item.id,
    kind: item.kind,
    label: item.label,
    help: item.help,
    required: item.required,
    hasCaution: item.caution !== null,
    hazard: item.caution?.hazard ?? "lifting",
    cautionText: item.caution?.text ?? "",
    ...(item.kind === "number"
      ? { unit: item.unit, min: numberText(item.min), max: numberText(item.max) }
      : {}),
    ...(item.kind === "choice" ? { options: item.options.join("\n") } : {}),
  };
}

export function draftOf(template: ChecklistTemplateView | null): Draft {
  if (template === null) return { title: "", purpose: "other", items: [emptyItem()] };
  return {
    title: template.title,
    purpose: template.purpose,
    items: template.items.map(draftItem),
  };
}

const typedNumber = (text: string) => (text.trim() === "" ? null : parseDecimal(text));

function itemInput(item: DraftItem, id: string): z.input<typeof checklistItem> {
  const common = {
    id,
    label: item.label,
    help: item.help,
    required: item.required,
    caution: item.hasCaution ? { hazard: item.hazard, text: item.cautionText } : null,
  };
  switch (item.kind) {
    case "number":
      return {
        kind: "number",
        ...common,
        unit: item.unit,
        min: typedNumber(item.min),
        max: typedNumber(item.max),
      };
    case "choice":
      return {
        kind: "choice",
        ...common,
        options: item.options
          .split("\n")
          .map((o) => o.trim())
          .filter((o) => o !== ""),
      };
    default:
      return { kind: item.kind, ...common };
  }
}

export type TemplateFields = Omit<ChecklistTemplateCreateInput, "id">;

export function toFields(draft: Draft): TemplateFields {
  const ids = assignItemIds(draft.items);
  return {
    title: draft.title,
    purpose: draft.purpose,
    items: draft.items.map((item, i) => itemInput(item, ids[i] ?? "")),
  };
}

/** Checks the draft with the server's own schema; the messages land at the same paths. */
export function checkDraft(draft: Draft): { fields: TemplateFields; errors: FieldErrors } {
  const fields = toFields(draft);
  const result = checklistTemplateFields.safeParse(fields);
  const errors: FieldErrors = {};
  if (!result.success)
    for (const issue of result.error.issues) {
      const path = issue.path.map(String).join(".");
      errors[path || "form"] ??= issue.message;
    }
  return { fields, errors };
}
