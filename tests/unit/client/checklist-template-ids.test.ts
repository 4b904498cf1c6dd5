// Item ids of edited templates: made from the label, unique, within the shared schema's pattern,
// and kept for items that were saved before. Expected ids are worked out by hand from the rule
// (lowercase, accents dropped, anything else a single dash).
import { describe, expect, it } from "vitest";
import {
  assignItemIds,
  slugFromLabel,
} from "../../../src/features/checklist-templates/lib/item-ids";
import { checklistItem } from "../../../shared/schemas/checklists";
import {
  checkDraft,
  draftOf,
  emptyItem,
} from "../../../src/features/checklist-templates/lib/draft";

const pattern = /^[a-z0-9][a-z0-9-]{0,39}$/;

describe("item ids from labels", () => {
  it.each([
    ["Room temperature (°C)", "room-temperature-c"],
    ["  Überdruck prüfen!  ", "uberdruck-prufen"],
    ["--Laser shutter--closed", "laser-shutter-closed"],
    ["???", "item"],
    ["", "item"],
  ])("makes %j into %j", (label, id) => {
    expect(slugFromLabel(label)).toBe(id);
  });

  it("stays within 40 characters and never ends on a dash", () => {
    const id = slugFromLabel(`${"a".repeat(39)} b`);
    expect(id).toBe("a".repeat(39));
    expect(id).toMatch(pattern);
  });

  it("numbers repeats and keeps saved ids even when the label changed", () => {
    const ids = assignItemIds([
      { id: "weather", label: "Forecast checked" },
      { id: null, label: "Weather" },
      { id: null, label: "Weather" },
      { id: null, label: "x".repeat(45) },
      { id: null, label: "x".repeat(45) },
    ]);
    expect(ids).toEqual([
      "weather",
      "weather-2",
      "weather-3",
      "x".repeat(40),
      `${"x".repeat(38)}-2`,
    ]);
    for (const id of ids) expect(id).toMatch(pattern);
    expect(new Set(ids).size).toBe(ids.length);
  });

  it("never takes a saved id that comes later in the list", () => {
    expect(
      assignItemIds([
        { id: null, label: "Pump" },
        { id: "pump", label: "Ion pump" },
      ]),
    ).toEqual(["pump-2", "pump"]);
  });
});

describe("the editor's draft", () => {
  it("turns a number item with a decimal comma into the shared schema's item", () => {
    const draft = draftOf(null);
    draft.title = "Arrival";
    draft.items = [
      { ...emptyItem(), kind: "number", label: "Room RH", unit: "%", min: "20", max: "60,5" },
    ];
    const { fields, errors } = checkDraft(draft);
    expect(errors).toEqual({});
    expect(checklistItem.parse(fields.items[0])).toMatchObject({
      id: "room-rh",
      kind: "number",
      min: 20,
      max: 60.5,
    });
  });

  it("puts messages at the paths the server uses", () => {
    const draft = draftOf(null);
    draft.items = [
      { ...emptyItem(), kind: "number", label: "T", min: "30", max: "20" },
      { ...emptyItem(), kind: "choice", label: "Pick", options: "Only one\n\n" },
      { ...emptyItem(), kind: "number", label: "N", min: "abc" },
    ];
    const { errors } = checkDraft(draft);
    expect(Object.keys(errors).sort()).toEqual([
      "items.0.max",
      "items.1.options",
      "items.2.min",
      "title",
    ]);
  });

  it("round-trips a saved template's items unchanged", () => {
    const items = [
      {
        kind: "choice" as const,
        id: "mains",
        label: "Mains power",
        help: "",
        required: false,
        caution: { hazard: "high-voltage" as const, text: "Follow local rules." },
        options: ["Stable", "None"],
      },
      {
        kind: "number" as const,
        id: "crate-count",
        label: "Crates",
        help: "",
        required: true,
        caution: null,
        unit: "",
        min: 1,
        max: null,
      },
    ];
    const draft = draftOf({
      id: crypto.randomUUID(),
      campaignId: crypto.randomUUID(),
      title: "T",
      purpose: "arrival",
      items,
      version: 3,
      updatedAt: "2027-06-01T00:00:00.000Z",
      deletedAt: null,
    });
    const [first] = draft.items;
    if (first === undefined) throw new Error("the draft lost its items");
    first.label = "Mains power at the site";
    const { fields, errors } = checkDraft(draft);
    expect(errors).toEqual({});
    expect(fields.items.map((i) => checklistItem.parse(i))).toEqual([
      { ...items[0], label: "Mains power at the site" },
      items[1],
    ]);
  });
});
