import { describe, expect, it } from "vitest";
import { actions, actionsOf, can, roles } from "../../../shared/permissions";

// The role table of DESIGN.md §6, restated here as the expectation the code must meet.
const expected: Record<string, string[]> = {
  field: [
    "campaign.read",
    "site.write",
    "attachment.write",
    "checklist.record",
    "entry.record",
    "levelling.record",
    "leg.record",
    "handover.record",
  ],
  logistics: [
    "campaign.read",
    "site.write",
    "site.delete",
    "attachment.write",
    "entry.record",
    "crate.manage",
    "leg.plan",
    "leg.record",
    "handover.record",
    "alert.acknowledge",
  ],
  geodesist: [
    "campaign.read",
    "site.write",
    "site.delete",
    "attachment.write",
    "levelling.record",
    "benchmark.manage",
    "instrument.manage",
    "levelling.adjust",
    "comparison.manage",
    "audit.read",
    "campaign.export",
  ],
  reviewer: ["campaign.read", "entry.review", "audit.read", "campaign.export"],
  admin: [
    "campaign.read",
    "site.write",
    "site.delete",
    "member.read",
    "member.manage",
    "invite.create",
    "attachment.write",
    "checklist.record",
    "entry.record",
    "levelling.record",
    "checklist.template.write",
    "crate.manage",
    "leg.plan",
    "leg.record",
    "handover.record",
    "alert.acknowledge",
    "benchmark.manage",
    "instrument.manage",
    "levelling.adjust",
    "comparison.manage",
    "entry.review",
    "audit.read",
    "campaign.export",
  ],
};

describe("permissions", () => {
  it.each(roles)("gives %s exactly its actions", (role) => {
    expect(actionsOf(role)).toEqual(expected[role]);
  });

  it("refuses everything without a role", () => {
    for (const action of actions) {
      expect(can(undefined, action)).toBe(false);
      expect(can(null, action)).toBe(false);
    }
  });
});
