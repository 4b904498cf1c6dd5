// Fractional values typed and shown, the instrument draft ↔ stored fields, the unusual-value
// warnings and the history's changes in words.
import { describe, expect, test } from "vitest";
import {
  instrumentFields,
  type InstrumentRevisionView,
  type InstrumentView,
} from "../../../shared/schemas/instruments";
import {
  formatFractional,
  fractionalForInput,
  parseFractional,
} from "../../../src/features/instruments/lib/fractional";
import {
  draftFromInstrument,
  fieldsFromDraft,
  quadratureOf,
} from "../../../src/features/instruments/lib/instrument-draft";
import { unusualValues } from "../../../src/features/instruments/lib/plausibility";
import { describeRevisions } from "../../../src/features/instruments/lib/revisions";

const clock: InstrumentView = {
  id: "0b7e4f8a-2c1d-4e5f-9a6b-7c8d9e0f1a2b",
  campaignId: "1b0f3f7e-5a7e-4c1d-8f4a-0e9d2c3b4a51",
  kind: "clock",
  name: "Kestrel transportable clock",
  description: "",
  instabilityAt1s: 1e-15,
  systematic: [
    { name: "blackbody radiation", value: 1.2e-18 },
    { name: "lattice light shift", value: 5e-19 },
  ],
  systematicTotal: 1.3e-18,
  notes: "",
  version: 1,
  updatedAt: "2027-06-01T08:00:00.000Z",
  updatedByName: "Ines Varodi",
};

describe("fractional values", () => {
  test.each([
    ["1e-15", 1e-15],
    ["1E-15", 1e-15],
    ["1,2e-18", 1.2e-18],
    [" 5e-16 ", 5e-16],
    ["1.2 × 10⁻¹⁸", 1.2e-18],
    ["1.2x10^-18", 1.2e-18],
    ["0", 0],
  ])("%j reads as %d", (text, value) => expect(parseFractional(text)).toBe(value));

  test.each(["", "small", "1e-", "10^-15"])("%j is not a number", (text) =>
    expect(parseFractional(text)).toBeNaN(),
  );

  test("shown in scientific notation, trailing zeros dropped", () => {
    expect(formatFractional(1e-15)).toBe("1 × 10⁻¹⁵");
    expect(formatFractional(1.2e-18)).toBe("1.2 × 10⁻¹⁸");
    // √(1.2² + 0.5²) = 1.3 exactly; √(1² + 1²) = 1.41421…
    expect(formatFractional(Math.sqrt(2) * 1e-18)).toBe("1.41 × 10⁻¹⁸");
    expect(formatFractional(0)).toBe("0");
    expect(formatFractional(Number.NaN)).toBe("—");
  });

  test("the display form reads back to the same value", () => {
    for (const v of [1e-15, 1.2e-18, 3.45e-17])
      expect(parseFractional(formatFractional(v))).toBeCloseTo(v, 30);
  });

  test("typed form is plain ASCII", () => {
    expect(fractionalForInput(1e-15)).toBe("1e-15");
    expect(fractionalForInput(1.2e-18)).toBe("1.2e-18");
  });
});

describe("instrument draft", () => {
  test("round-trips a stored instrument", () => {
    const fields = fieldsFromDraft(draftFromInstrument(clock));
    expect(fields).toEqual({
      kind: "clock",
      name: clock.name,
      description: "",
      instabilityAt1s: 1e-15,
      systematic: clock.systematic,
      notes: "",
    });
    expect(instrumentFields.safeParse(fields).success).toBe(true);
  });

  test("empty rows at the end are dropped; others are checked where they are", () => {
    const draft = {
      ...draftFromInstrument(null),
      name: "Link L1",
      instabilityAt1s: "3e-17",
      systematic: [
        { name: "", value: "" },
        { name: "fibre noise", value: "2e-19" },
        { name: "", value: "" },
        { name: " ", value: "" },
      ],
    };
    const fields = fieldsFromDraft(draft);
    expect(fields.systematic).toHaveLength(2);
    const parsed = instrumentFields.safeParse(fields);
    expect(parsed.error?.issues.map((i) => [i.path.join("."), i.message])).toEqual([
      ["systematic.0.name", "Term name is required"],
      ["systematic.0.value", "Term value must be a number"],
    ]);
  });

  test("quadrature as the server computes the total", () => {
    expect(quadratureOf([1.2e-18, 5e-19])).toBeCloseTo(1.3e-18, 30);
    expect(quadratureOf([])).toBe(0);
    expect(quadratureOf([1e-18, Number.NaN])).toBeNaN();
  });
});

describe("unusual values", () => {
  test("values the schema refuses get no warning (their error is at the field)", () => {
    expect(
      unusualValues({ instabilityAt1s: 1e15, systematic: [{ name: "x", value: 1e-3 }] }),
    ).toEqual([]);
  });
  test("usual figures give no warning", () => {
    expect(unusualValues(clock)).toEqual([]);
  });
  test("an exponent one off is pointed out, not refused", () => {
    expect(
      unusualValues({
        instabilityAt1s: 1e-12,
        systematic: [{ name: "Zeeman shift", value: 2e-13 }],
      }),
    ).toEqual([
      "Instability at 1 s of 1 × 10⁻¹² is outside the usual 1 × 10⁻¹⁷ … 1 × 10⁻¹³: check the exponent.",
      "Zeeman shift of 2 × 10⁻¹³ is above the usual 1 × 10⁻¹⁴: check the exponent.",
    ]);
  });
});

describe("history", () => {
  const at = (minute: number) => `2027-06-01T08:${String(minute).padStart(2, "0")}:00.000Z`;
  const revisions: InstrumentRevisionView[] = [
    {
      at: at(0),
      action: "create",
      byName: "Ines Varodi",
      version: 1,
      changed: ["kind", "name", "description", "instabilityAt1s", "systematic", "notes"],
      after: clock,
    },
    {
      at: at(5),
      action: "update",
      byName: "Ines Varodi",
      version: 2,
      changed: ["instabilityAt1s"],
      after: { ...clock, instabilityAt1s: 8e-16, version: 2 },
    },
    { at: at(9), action: "delete", byName: "Leila Brandvik", version: 3, changed: [], after: null },
  ];

  test("each change with the value before and after; a creation without its empty texts", () => {
    const lines = describeRevisions(revisions);
    expect(lines.map((l) => l.changes.length)).toEqual([4, 1, 0]);
    expect(lines[0]?.changes[3]).toEqual({
      field: "systematic",
      label: "Systematic terms",
      before: null,
      after: "blackbody radiation 1.2 × 10⁻¹⁸; lattice light shift 5 × 10⁻¹⁹",
    });
    expect(lines[1]?.changes).toEqual([
      {
        field: "instabilityAt1s",
        label: "Instability at 1 s",
        before: "1 × 10⁻¹⁵",
        after: "8 × 10⁻¹⁶",
      },
    ]);
  });
});
