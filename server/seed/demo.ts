// The demo scenario: an invented campaign with invented sites and people. Seeded only into an empty
// database and never when NODE_ENV=production.
import { sql } from "drizzle-orm";
import type { Role } from "../../shared/permissions";
import type { SiteKind } from "../../shared/schemas/sites";
import { nextChangeSeq } from "../db/change-seq";
import type { Db } from "../db/client";
import { checklistItems } from "../../shared/schemas/checklists";
import {
  benchmarks,
  campaigns,
  checklistTemplates,
  crates,
  legs,
  memberships,
  sites,
  users,
} from "../db/schema";
import { demoChecklists } from "./demo-checklists";
import { demoBenchmarks, demoCrates, demoLegs } from "./demo-scenario";
import { seedDemoGeodesy } from "./demo-geodesy";
import { seedDemoNetwork } from "./demo-network";
import { hashPassword } from "../services/passwords";

export const demoPassword = "equipot-demo";

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: "field@demo.equipot.test", name: "Mira Castell", role: "field" },
  { email: "logistics@demo.equipot.test", name: "Jonas Weilgart", role: "logistics" },
  { email: "geodesist@demo.equipot.test", name: "Ines Varodi", role: "geodesist" },
  { email: "reviewer@demo.equipot.test", name: "Tomas Reuterholm", role: "reviewer" },
  { email: "admin@demo.equipot.test", name: "Leila Brandvik", role: "admin" },
];

export const demoCampaign = {
  name: "Kestrel Ridge height link 2027",
  description:
    "A transportable clock taken from the Brennmoor reference laboratory to the Kestrel Ridge hut and the Saltmere tide station, tied by levelling to the local benchmarks.",
};

const demoSites: {
  name: string;
  kind: SiteKind;
  latitudeDeg: number;
  longitudeDeg: number;
  approxHeightM: number;
  notes: string;
}[] = [
  {
    name: "Brennmoor reference laboratory",
    kind: "reference-lab",
    latitudeDeg: 50.3127,
    longitudeDeg: 9.4581,
    approxHeightM: 212,
    notes: "Reference clock room B2. Fibre link patch panel in the basement corridor.",
  },
  {
    name: "Kestrel Ridge hut",
    kind: "mountain",
    latitudeDeg: 47.0842,
    longitudeDeg: 11.2273,
    approxHeightM: 2871,
    notes:
      "Access by cable car until 16:00 UTC. Weather turns fast above the tree line: check the forecast before moving crates.",
  },
  {
    name: "Saltmere tide station",
    kind: "coastal",
    latitudeDeg: 54.1766,
    longitudeDeg: 8.0391,
    approxHeightM: 4,
    notes: "Tide gauge hut on the harbour wall. Salt spray: keep crates closed outside.",
  },
];

export async function isDatabaseEmpty(db: Db): Promise<boolean> {
  const result = await db.execute<{ n: number }>(sql`select count(*)::int as n from campaigns`);
  return (result.rows[0]?.n ?? 0) === 0;
}

/** Seeds the demo campaign. Returns false (and writes nothing) when the database already has data. */
export async function seedDemo(db: Db, nodeEnv: string): Promise<boolean> {
  if (nodeEnv === "production")
    throw new Error("The demo seed never runs with NODE_ENV=production");
  if (!(await isDatabaseEmpty(db))) return false;
  const passwordHash = await hashPassword(demoPassword);
  const geodesy = await db.transaction(async (tx) => {
    const [campaign] = await tx.insert(campaigns).values(demoCampaign).returning();
    const [practice] = await tx
      .insert(campaigns)
      .values({
        name: "Practice traverse (training)",
        description: "A small campaign for training new crew members.",
      })
      .returning();
    if (!campaign || !practice) throw new Error("demo campaigns were not created");
    const people = await tx
      .insert(users)
      .values(demoAccounts.map(({ email, name }) => ({ email, name, passwordHash })))
      .returning();
    await tx.insert(memberships).values(
      people.map((person, i) => ({
        campaignId: campaign.id,
        userId: person.id,
        role: demoAccounts[i]?.role ?? "field",
      })),
    );
    const admin = people.find((p) => p.email.startsWith("admin@"));
    if (admin)
      await tx
        .insert(memberships)
        .values({ campaignId: practice.id, userId: admin.id, role: "admin" });
    const siteIds = new Map<string, string>();
    for (const site of demoSites) {
      const changeSeq = await nextChangeSeq(tx, campaign.id);
      const id = crypto.randomUUID();
      siteIds.set(site.name, id);
      await tx
        .insert(sites)
        .values({ ...site, id, campaignId: campaign.id, updatedBy: admin?.id ?? null, changeSeq });
    }
    const updatedBy = admin?.id ?? null;
    const crateIds = new Map<string, string>();
    for (const crate of demoCrates) {
      const changeSeq = await nextChangeSeq(tx, campaign.id);
      const id = crypto.randomUUID();
      crateIds.set(crate.label, id);
      await tx.insert(crates).values({
        ...crate,
        id,
        campaignId: campaign.id,
        updatedBy,
        changeSeq,
      });
    }
    const planner = people.find((p) => p.email.startsWith("logistics@"));
    for (const leg of demoLegs) {
      const crateId = crateIds.get(leg.crateLabel);
      const fromSiteId = siteIds.get(leg.from);
      const toSiteId = siteIds.get(leg.to);
      if (!crateId || !fromSiteId || !toSiteId) throw new Error(`demo leg of ${leg.crateLabel}`);
      await tx.insert(legs).values({
        id: crypto.randomUUID(),
        campaignId: campaign.id,
        crateId,
        fromSiteId,
        toSiteId,
        vehicle: leg.vehicle,
        plannedDepartAt: new Date(leg.plannedDepartAt),
        plannedArriveAt: new Date(leg.plannedArriveAt),
        note: leg.note,
        createdBy: planner?.id ?? null,
        changeSeq: await nextChangeSeq(tx, campaign.id),
      });
    }
    for (const template of demoChecklists) {
      const changeSeq = await nextChangeSeq(tx, campaign.id);
      await tx.insert(checklistTemplates).values({
        id: crypto.randomUUID(),
        campaignId: campaign.id,
        title: template.title,
        purpose: template.purpose,
        items: checklistItems.parse(template.items),
        updatedBy,
        changeSeq,
      });
    }
    for (const benchmark of demoBenchmarks) {
      const changeSeq = await nextChangeSeq(tx, campaign.id);
      await tx.insert(benchmarks).values({
        ...benchmark,
        id: crypto.randomUUID(),
        campaignId: campaign.id,
        updatedBy,
        changeSeq,
      });
    }
    const geodesist = people.find((p) => p.email.startsWith("geodesist@"));
    await seedDemoNetwork(tx, campaign.id, geodesist?.id ?? null);
    const hut = demoSites.find((site) => site.kind === "mountain");
    return {
      campaignId: campaign.id,
      site: { id: siteIds.get(hut?.name ?? "") ?? "", latitudeDeg: hut?.latitudeDeg ?? 0 },
      userId: geodesist?.id ?? admin?.id ?? "",
    };
  });
  // Tests make their own instruments and runs; a demo for people gets one to look at. Through the
  // real upload path, so after the campaign's own transaction.
  if (nodeEnv !== "test")
    await seedDemoGeodesy(db, geodesy.campaignId, geodesy.site, geodesy.userId);
  return true;
}
