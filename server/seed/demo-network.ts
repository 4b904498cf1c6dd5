// The demo campaign's imported levelling ties (invented): the clock reference point at the
// Kestrel Ridge hut (KR-CRP) tied to the benchmarks KR-BM-117 and KR-BM-118 through a turning
// point, and the two benchmarks tied to each other, so the loop has redundancy (2 degrees of
// freedom). By hand: KR-BM-117 → KR-CRP → KR-TP1 → KR-BM-118 sums to −28.3338 m against the
// benchmarks' −28.335 m (1.2 mm); the direct tie reads +28.3368 m (1.8 mm off).
import type { Tx } from "../db/client";
import { insertTies } from "../db/repositories/height-network";

export const demoTies = [
  { fromMark: "KR-BM-117", toMark: "KR-CRP", deltaM: 0.7741, lengthKm: 0.12 },
  { fromMark: "KR-CRP", toMark: "KR-TP1", deltaM: -14.552, lengthKm: 0.4 },
  { fromMark: "KR-TP1", toMark: "KR-BM-118", deltaM: -14.5559, lengthKm: 0.45 },
  { fromMark: "KR-BM-118", toMark: "KR-BM-117", deltaM: 28.3368, lengthKm: 0.78 },
] as const;

export const demoTieSource = "Kestrel Ridge levelling, June 2027 (demo)";

/** σ comes from the length (σ per √km) at adjustment time, as for a field-book section. */
export async function seedDemoNetwork(
  tx: Tx,
  campaignId: string,
  importedBy: string | null = null,
): Promise<void> {
  await insertTies(
    tx,
    demoTies.map((tie) => ({
      ...tie,
      sigmaM: null,
      source: demoTieSource,
      campaignId,
      importedBy,
    })),
  );
}
