// Seeding, not timed: 100,000 temperature samples for one crate sent as a tablet would (logger
// import parts of 5,000 samples through POST /api/sync/push), and 10,000 legs written straight
// into PostgreSQL (pushing them one mutation each would take most of the time budget here).
import { connect } from "../../server/db/client";
import { takeChangeSeqs } from "../../server/db/change-seq";
import { legs } from "../../server/db/schema";
import { fieldEntryLimits, type FieldEntryInput } from "../../shared/schemas/field-entries";
import { protocolVersion, pullResponse, pushResponse } from "../../shared/sync/protocol";
import { signIn } from "../sync/client";

export interface DemoCampaign {
  campaignId: string;
  token: string;
  /** The site whose board and temperatures are measured, and its crate drawn first (by label). */
  siteId: string;
  siteName: string;
  crateId: string;
  crateLabel: string;
  siteIds: string[];
  crateIds: string[];
  /** The demo's own legs, so the dashboard's "n of n legs" can be awaited exactly. */
  legs: number;
}

const boardSite = "Kestrel Ridge hut";

export async function readDemoCampaign(baseUrl: string, email: string): Promise<DemoCampaign> {
  const session = await signIn(baseUrl, email);
  const campaignId = session.campaignIds[0] ?? "";
  const query = `protocolVersion=${protocolVersion}&campaign=${campaignId}&limit=1000`;
  const res = await fetch(`${baseUrl}/api/sync/pull?${query}`, {
    headers: { authorization: `Bearer ${session.token}` },
  });
  const { changes } = pullResponse.parse(await res.json());
  const sites = changes.flatMap((c) => (c.entity === "site" && c.data ? [c.data] : []));
  const crates = changes.flatMap((c) => (c.entity === "crate" && c.data ? [c.data] : []));
  crates.sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }));
  const site = sites.find((s) => s.name === boardSite);
  const crate = crates[0];
  if (site === undefined || crate === undefined) throw new Error("the demo campaign is incomplete");
  return {
    campaignId,
    token: session.token,
    siteId: site.id,
    siteName: site.name,
    crateId: crate.id,
    crateLabel: crate.label,
    siteIds: sites.map((s) => s.id),
    crateIds: crates.map((c) => c.id),
    legs: changes.filter((c) => c.entity === "leg").length,
  };
}

const startMs = Date.parse("2027-06-01T00:00:00.000Z");
const intervalS = 60;

/** One import part: samples i0 … i0 + count − 1 of a once-a-minute logger, mostly inside the band. */
function temperaturePart(demo: DemoCampaign, importId: string, part: number, parts: number) {
  const per = fieldEntryLimits.samplesMax;
  const i0 = (part - 1) * per;
  const samples = Array.from({ length: per }, (_, k) => {
    const i = i0 + k;
    const celsius = 20 + 6 * Math.sin(i / 700) + 0.3 * Math.sin(i * 1.7);
    const at = new Date(startMs + i * intervalS * 1000).toISOString();
    return { at, celsius: Math.round(celsius * 100) / 100, humidityPct: 40 };
  });
  const entry: FieldEntryInput = {
    id: crypto.randomUUID(),
    siteId: demo.siteId,
    crateId: demo.crateId,
    observedAt: samples[0]?.at ?? new Date(startMs).toISOString(),
    recordedAt: new Date().toISOString(),
    data: {
      kind: "temperatures",
      source: "logger",
      loggerModel: "Bench logger",
      import: { importId, fileName: "bench-100k.csv", part, parts },
      samples,
    },
  };
  return entry;
}

export async function pushTemperatures(
  baseUrl: string,
  demo: DemoCampaign,
  total: number,
): Promise<number> {
  const parts = Math.ceil(total / fieldEntryLimits.samplesMax);
  const importId = crypto.randomUUID();
  const clientId = crypto.randomUUID();
  // One part per push keeps each body near 0.3 MB, under the server's 1 MB limit.
  for (let part = 1; part <= parts; part++) {
    const res = await fetch(`${baseUrl}/api/sync/push`, {
      method: "POST",
      headers: { "content-type": "application/json", authorization: `Bearer ${demo.token}` },
      body: JSON.stringify({
        protocolVersion,
        clientId,
        campaignId: demo.campaignId,
        mutations: [
          {
            mutationId: part,
            name: "entry.add",
            args: temperaturePart(demo, importId, part, parts),
            createdAt: new Date().toISOString(),
          },
        ],
      }),
    });
    const body = pushResponse.parse(await res.json());
    const result = body.results[0];
    if (result?.status !== "applied")
      throw new Error(`temperature part ${part} was ${result?.status}: ${result?.message}`);
  }
  return parts * fieldEntryLimits.samplesMax;
}

/** n planned legs between the demo sites, spread over a year, in one transaction. */
export async function insertLegs(databaseUrl: string, demo: DemoCampaign, n: number) {
  const database = connect(databaseUrl, 1);
  try {
    await database.db.transaction(async (tx) => {
      const first = await takeChangeSeqs(tx, demo.campaignId, n);
      const batch = 1000;
      for (let b = 0; b < n; b += batch) {
        const rows = Array.from({ length: Math.min(batch, n - b) }, (_, k) => {
          const i = b + k;
          const from = demo.siteIds[i % demo.siteIds.length] ?? "";
          const to = demo.siteIds[(i + 1) % demo.siteIds.length] ?? "";
          const departMs = startMs + i * 3_150_000;
          return {
            id: crypto.randomUUID(),
            campaignId: demo.campaignId,
            crateId: demo.crateIds[i % demo.crateIds.length] ?? "",
            fromSiteId: from,
            toSiteId: to,
            vehicle: `Bench van ${i % 40}`,
            plannedDepartAt: new Date(departMs),
            plannedArriveAt: new Date(departMs + 6 * 3_600_000),
            note: `Invented leg ${i} for the client benchmark`,
            changeSeq: first + i,
          };
        });
        await tx.insert(legs).values(rows);
      }
    });
  } finally {
    await database.close();
  }
}
