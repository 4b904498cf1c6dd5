// One role → action table, used by the server's middleware and by the client to show or hide actions.
export const roles = ["field", "logistics", "geodesist", "reviewer", "admin"] as const;
export type Role = (typeof roles)[number];

export const actions = [
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
] as const;
export type Action = (typeof actions)[number];

const table: Record<Action, readonly Role[]> = {
  // Logistics keeps the crates and plans their journeys (DESIGN.md §6).
  "crate.manage": ["logistics", "admin"],
  "leg.plan": ["logistics", "admin"],
  // Departures, arrivals and handovers are recorded by whoever is with the crate.
  "leg.record": ["field", "logistics", "admin"],
  "handover.record": ["field", "logistics", "admin"],
  "alert.acknowledge": ["logistics", "admin"],
  "campaign.read": roles,
  "site.write": ["field", "logistics", "geodesist", "admin"],
  "site.delete": ["logistics", "geodesist", "admin"],
  "member.read": ["admin"],
  "member.manage": ["admin"],
  "invite.create": ["admin"],
  "attachment.write": ["field", "logistics", "geodesist", "admin"],
  // The crew works through checklists; an administrator may stand in (DESIGN.md §6).
  "checklist.record": ["field", "admin"],
  // Shock and temperature readings are taken by the crew and, at the depot, by logistics.
  "entry.record": ["field", "logistics", "admin"],
  // Spirit levelling is done by the crew or the geodesist.
  "levelling.record": ["field", "geodesist", "admin"],
  // Templates are kept by administrators, in the office (DESIGN.md §6).
  "checklist.template.write": ["admin"],
  // The geodesist keeps the height side of the campaign (DESIGN.md §6).
  "benchmark.manage": ["geodesist", "admin"],
  "instrument.manage": ["geodesist", "admin"],
  "levelling.adjust": ["geodesist", "admin"],
  "comparison.manage": ["geodesist", "admin"],
  // Office review: approve, send back, reopen (DESIGN.md §6); the trail and exports go with it.
  "entry.review": ["reviewer", "admin"],
  "audit.read": ["geodesist", "reviewer", "admin"],
  "campaign.export": ["geodesist", "reviewer", "admin"],
};

export function can(role: Role | undefined | null, action: Action): boolean {
  return role != null && table[action].includes(role);
}

export function actionsOf(role: Role): Action[] {
  return actions.filter((action) => can(role, action));
}

export const roleLabels: Record<Role, string> = {
  field: "Field crew",
  logistics: "Logistics",
  geodesist: "Geodesist",
  reviewer: "Reviewer",
  admin: "Administrator",
};
