// The chain of custody's rule, as tablet and server both apply it (cases worked by hand).
import { describe, expect, it } from "vitest";
import { custodyProblem } from "../../../shared/custody";

const last = { at: "2027-06-10T13:20:00Z", toName: "Hut crew lead " };

describe("custody", () => {
  it("takes the first handover of a crate as it comes", () => {
    expect(custodyProblem(null, { at: "2020-01-01T00:00:00Z", fromName: "Anyone" })).toBeNull();
  });

  it("refuses a handover not after the last one, the same instant included", () => {
    for (const at of ["2027-06-10T13:19:59Z", "2027-06-10T15:20:00+02:00"])
      expect(custodyProblem(last, { at, fromName: "Hut crew lead" })).toEqual({
        field: "at",
        kind: "out-of-order",
      });
  });

  it("wants the giver to be the last receiver, ignoring case and spaces at the ends", () => {
    const later = "2027-06-10T14:00:00Z";
    expect(custodyProblem(last, { at: later, fromName: "  hut CREW lead" })).toBeNull();
    expect(custodyProblem(last, { at: later, fromName: "Van driver" })).toEqual({
      field: "fromName",
      kind: "wrong-giver",
      holder: "Hut crew lead",
    });
  });
});
