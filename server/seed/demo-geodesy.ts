// The demo campaign's geodesy (invented): the Brennmoor laboratory clock, the transportable clock
// EQ-T1 at the Kestrel Ridge hut, the fibre link between them, and one comparison run with two
// days of a synthetic series at 10 s — white FM of 1.5e-15 at 1 s around the offset an 8 mm
// higher hut would give, with a three-hour outage. Stored through the real upload path, and the
// levelling network adjusted once (the ties are seeded with the campaign).
import { Readable } from "node:stream";
import { frequencyFromHeightDifference } from "../../shared/science";
import type { Db } from "../db/client";
import { instruments } from "../db/schema";
import { adjustmentOptions } from "../../shared/schemas/height-network";
import { createRun } from "../services/comparison/runs";
import { adjustNetwork } from "../services/height-network/adjust";
import { createSciencePool } from "../workers/science-pool";
import { uploadSeries } from "../services/comparison/upload";

export const demoInstruments = [
  {
    kind: "clock",
    name: "Brennmoor laboratory clock LS-1",
    description: "Reference clock in room B2.",
    instabilityAt1s: 4e-16,
    systematic: [
      { name: "blackbody radiation", value: 1.0e-18 },
      { name: "lattice light shift", value: 8e-19 },
      { name: "second-order Zeeman", value: 3e-19 },
    ],
  },
  {
    kind: "clock",
    name: "Transportable clock EQ-T1",
    description: "The campaign's transportable clock, in crates EQ-01 to EQ-05.",
    instabilityAt1s: 1.5e-15,
    systematic: [
      { name: "blackbody radiation", value: 1.5e-18 },
      { name: "lattice light shift", value: 1.0e-18 },
      { name: "collisional shift", value: 5e-19 },
    ],
  },
  {
    kind: "link",
    name: "Brennmoor–Kestrel fibre link",
    description: "Stabilised fibre through the valley exchange.",
    instabilityAt1s: 1e-16,
    systematic: [{ name: "uncompensated path noise", value: 2e-19 }],
  },
] as const;

export const demoRun = {
  name: "Kestrel Ridge hut against Brennmoor",
  linkName: "Brennmoor–Kestrel fibre link",
  remoteMark: "KR-CRP",
  /** The laboratory clock's reference point, from the laboratory's own levelling (invented). */
  referenceHeightM: 212.483,
  referenceHeightSigmaM: 0.003,
  targetHeightUncertaintyM: 0.03,
  plannedUptime: 0.7,
};

/** mulberry32: the same demo series on every seed. */
function prng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export function demoSeriesCsv(meanFractional: number): string {
  const next = prng(2027);
  const tau0 = 10;
  const start = Date.UTC(2027, 6, 12) / 1000;
  const perSample = 1.5e-15 / Math.sqrt(tau0);
  const lines = ["time,value"];
  for (let i = 0; i < 17_280; i++) {
    const g = Math.sqrt(-2 * Math.log(1 - next())) * Math.cos(2 * Math.PI * next());
    if (i >= 6_000 && i < 7_080) continue; // 3 h with the laser unlocked
    const t = new Date((start + i * tau0) * 1000).toISOString();
    lines.push(`${t},${(meanFractional + perSample * g).toExponential(6)}`);
  }
  return lines.join("\n") + "\n";
}

export async function seedDemoGeodesy(
  db: Db,
  campaignId: string,
  remoteSite: { id: string; latitudeDeg: number },
  userId: string,
): Promise<void> {
  const ids = demoInstruments.map(() => crypto.randomUUID());
  await db.insert(instruments).values(
    demoInstruments.map((i, n) => ({
      ...i,
      systematic: [...i.systematic],
      id: ids[n] ?? crypto.randomUUID(),
      campaignId,
      updatedBy: userId,
    })),
  );
  const [reference = "", remote = "", link = ""] = ids;
  const scope = { campaignId, userId };
  const runId = crypto.randomUUID();
  await createRun(db, scope, {
    id: runId,
    run: {
      ...demoRun,
      remoteSiteId: remoteSite.id,
      remoteClockId: remote,
      referenceClockId: reference,
      linkId: link,
      notes: "Demo run: a synthetic series.",
    },
  });
  // KR-CRP adjusts to about 2870.186 m; the clocks are made to read 8 mm more.
  const { fractionalFrequency } = frequencyFromHeightDifference({
    heightDifferenceM: 2870.186 + 0.008 - demoRun.referenceHeightM,
    latitudeDeg: remoteSite.latitudeDeg,
    heightM: demoRun.referenceHeightM,
  });
  const outcome = await uploadSeries(
    db,
    scope,
    runId,
    { fileName: "kestrel-2027-07-12.csv", valueKind: "fractional" },
    Readable.from([demoSeriesCsv(fractionalFrequency)]),
  );
  if (!outcome.ok) throw new Error(`the demo series was refused: ${outcome.message}`);
  // The network adjusted once, so the run's result shows the levelled height from the start.
  const science = createSciencePool(1);
  try {
    await adjustNetwork(db, science, scope, adjustmentOptions.parse({}));
  } finally {
    await science.close();
  }
}
