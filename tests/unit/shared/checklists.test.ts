// Checklist items and results: the schema refuses what a template must not hold, and a number
// outside its range is flagged the same way on the tablet and the server.
import { describe, expect, it } from "vitest";
import { checkResult, describeRange } from "../../../shared/checklists";
import { checklistItem, checklistItems } from "../../../shared/schemas/checklists";
import { demoChecklists } from "../../../server/seed/demo-checklists";

const number = checklistItem.parse({
  kind: "number",
  id: "room-temp",
  label: "Room temperature",
  unit: "°C",
  min: 18,
  max: 26,
});

describe("checklist items", () => {
  it("flags a number outside its range, and only then", () => {
    expect(checkResult(number, 17.9)).toEqual({ ok: true, outOfRange: true });
    expect(checkResult(number, 18)).toEqual({ ok: true, outOfRange: false });
    expect(checkResult(number, 26)).toEqual({ ok: true, outOfRange: false });
    expect(checkResult(number, 26.1)).toEqual({ ok: true, outOfRange: true });
    expect(checkResult(number, "20")).toEqual({
      ok: false,
      message: "Room temperature: expected a number",
    });
    if (number.kind !== "number") throw new Error("parsed as another kind");
    expect(describeRange(number)).toBe("between 18 and 26 °C");
  });

  it("accepts only a listed option for a choice, and a boolean for a check", () => {
    const choice = checklistItem.parse({
      kind: "choice",
      id: "mains",
      label: "Mains",
      options: ["Stable", "None"],
    });
    expect(checkResult(choice, "None")).toEqual({ ok: true, outOfRange: false });
    expect(checkResult(choice, "Maybe")).toMatchObject({ ok: false });
    const check = checklistItem.parse({ kind: "check", id: "door", label: "Door open" });
    expect(checkResult(check, true)).toEqual({ ok: true, outOfRange: false });
    expect(checkResult(check, 1)).toMatchObject({ ok: false });
  });

  it("refuses a range upside down, duplicate ids and a choice with one option, naming the field", () => {
    const upside = checklistItem.safeParse({ kind: "number", id: "x", label: "X", min: 5, max: 1 });
    expect(upside.error?.issues[0]).toMatchObject({ path: ["max"] });
    const twice = checklistItems.safeParse([
      { kind: "check", id: "a", label: "A" },
      { kind: "check", id: "a", label: "Again" },
    ]);
    expect(twice.error?.issues[0]?.message).toBe("Item ids must be unique within a checklist");
    const one = checklistItem.safeParse({ kind: "choice", id: "c", label: "C", options: ["Only"] });
    expect(one.error?.issues[0]).toMatchObject({ path: ["options"] });
  });

  it("has demo templates that are valid, with a caution wherever a step can hurt someone", () => {
    expect(demoChecklists.map((t) => t.purpose)).toEqual([
      "arrival",
      "unpacking",
      "vacuum-bakeout",
      "laser-lockup",
      "comparison-start",
      "pack-down",
    ]);
    const hazards = new Set<string>();
    for (const template of demoChecklists) {
      const items = checklistItems.parse(template.items);
      for (const item of items) {
        if (item.caution === null) continue;
        hazards.add(item.caution.hazard);
        expect(item.caution.text).toMatch(/local regulations and the site's safety officer/);
      }
    }
    expect([...hazards].sort()).toEqual([
      "battery",
      "high-voltage",
      "hot-surface",
      "laser",
      "lifting",
      "weather",
    ]);
  });
});
