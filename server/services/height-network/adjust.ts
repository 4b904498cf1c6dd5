// One least-squares adjustment of the campaign's network, computed in the science worker pool (the
// API never blocks on it) and kept whole as an AdjustmentView: the comparison runs read it back.
import { randomUUID } from "node:crypto";
import type { AdjustmentResult } from "../../../shared/science";
import { ScienceInputError } from "../../../shared/science/errors";
import type { AdjustmentOptions, AdjustmentView } from "../../../shared/schemas/height-network";
import type { Db } from "../../db/client";
import { recordAudit } from "../../db/repositories/audit";
import { insertAdjustment, liveBenchmarks } from "../../db/repositories/height-network";
import { findUserById } from "../../db/repositories/users";
import { HttpError } from "../../http-errors";
import type { SciencePool } from "../../workers/science-pool";
import { networkObservations } from "../height-network.service";
import type { Scope } from "../revision";
import { prepareNetwork, type NetworkObservation, type PreparedNetwork } from "./network";

/** |w| above 3.29 (α0 = 0.001, two-sided) flags a blunder: the core's default, said here too. */
export const criticalStandardized = 3.29;

const unprocessable = (message: string) => new HttpError(422, "bad_request", message);

function requireAdjustable(all: NetworkObservation[], net: PreparedNetwork): void {
  if (all.length === 0)
    throw unprocessable(
      "The network has no observations yet: close a field-book section or import height ties",
    );
  if (net.fixed.length === 0)
    throw unprocessable(
      "No benchmark is in the network: at least one observation must start or end at a benchmark's code",
    );
  if (net.used.length === 0)
    throw unprocessable("Every observation joined to a benchmark is left out");
}

async function compute(science: SciencePool, net: PreparedNetwork, options: AdjustmentOptions) {
  const unknowns = new Set(net.used.flatMap((o) => [o.fromMark, o.toMark]));
  for (const b of net.fixed) unknowns.delete(b.code);
  const test = net.used.length - unknowns.size > 0;
  try {
    return await science.run("adjust", {
      network: {
        fixed: net.fixed.map((b) => ({ point: b.code, heightM: b.heightM })),
        observations: net.used.map((o) => ({
          from: o.fromMark,
          to: o.toMark,
          deltaM: o.deltaM,
          lengthKm: o.lengthKm,
          ...(o.ownSigmaM === null ? {} : { sigmaM: o.ownSigmaM }),
        })),
      },
      options: {
        sigmaPerSqrtKmM: options.sigmaPerSqrtKmMm / 1000,
        significance: options.significance,
        criticalStandardized,
        test,
      },
    });
  } catch (error) {
    if (error instanceof ScienceInputError) throw unprocessable(error.message);
    throw error;
  }
}

function toView(
  net: PreparedNetwork,
  result: AdjustmentResult,
  meta: Pick<AdjustmentView, "computedByName" | "options" | "unconnected" | "observationCount">,
): AdjustmentView {
  const byCode = new Map(net.fixed.map((b) => [b.code, b]));
  const sigmaOf = (o: NetworkObservation) =>
    o.ownSigmaM ?? (meta.options.sigmaPerSqrtKmMm / 1000) * Math.sqrt(o.lengthKm);
  return {
    id: randomUUID(),
    computedAt: new Date().toISOString(),
    ...meta,
    points: result.heights.map((h) => ({
      mark: h.point,
      heightM: h.heightM,
      sigmaM: h.sigmaM,
      fixed: h.fixed,
      benchmarkId: byCode.get(h.point)?.id ?? null,
      benchmarkSigmaM: byCode.get(h.point)?.heightSigmaM ?? null,
    })),
    observations: result.residuals.map((r) => {
      const o = net.used[r.index];
      if (o === undefined) throw new Error(`residual ${r.index} has no observation`);
      return {
        sourceId: o.sourceId,
        source: o.source,
        fromMark: o.fromMark,
        toMark: o.toMark,
        deltaM: o.deltaM,
        lengthKm: o.lengthKm,
        sigmaM: sigmaOf(o),
        residualM: r.residualM,
        standardized: r.standardized,
        redundancy: r.redundancy,
        flagged:
          Math.abs(r.standardized) > criticalStandardized || result.suspect?.index === r.index,
      };
    }),
    dof: result.dof,
    sigma0: result.sigma0,
    globalTest: result.globalTest,
  };
}

export async function adjustNetwork(
  db: Db,
  science: SciencePool,
  scope: Scope,
  options: AdjustmentOptions,
): Promise<AdjustmentView> {
  const all = await networkObservations(db, scope.campaignId);
  const net = prepareNetwork(all, await liveBenchmarks(db, scope.campaignId), options.excluded);
  requireAdjustable(all, net);
  const result = await compute(science, net, options);
  const user = await findUserById(db, scope.userId);
  const view = toView(net, result, {
    computedByName: user?.name ?? null,
    options: { ...options },
    unconnected: net.unconnected,
    observationCount: all.length,
  });
  await db.transaction(async (tx) => {
    await insertAdjustment(tx, scope.campaignId, scope.userId, view);
    await recordAudit(tx, {
      campaignId: scope.campaignId,
      userId: scope.userId,
      action: "create",
      entity: "levelling-adjustment",
      entityId: view.id,
      after: { options: view.options, dof: view.dof, sigma0: view.sigma0 },
    });
  });
  return view;
}
