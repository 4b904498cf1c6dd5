// The height result of a comparison run: ΔH from the clocks (mean y of the analysed series), its
// budget, the levelled ΔH from the latest adjustment, their difference, and the time left to
// the target (budget.ts). Pure: the server reads the rows, this decides.
import {
  heightDifferenceFromFrequency,
  heightPerFractionalFrequency,
  heightUncertaintyAt,
  timeToTarget,
  type TimeToTargetInput,
} from "../science";
import {
  officialHeightsCaution,
  type BudgetRowView,
  type ComparisonRunView,
  type HeightResultView,
  type SeriesAnalysis,
} from "../schemas/comparison";
import type { AdjustmentView } from "../schemas/height-network";
import { explainUnreachable } from "./height-explain";

export interface InstrumentFigures {
  readonly name: string;
  readonly instabilityAt1s: number;
  readonly systematic: readonly { readonly name: string; readonly value: number }[];
}

export interface HeightResultInput {
  readonly run: ComparisonRunView;
  /** The remote site: the plumb line of c²/γ. */
  readonly site: { readonly latitudeDeg: number; readonly approxHeightM: number };
  readonly remoteClock: InstrumentFigures;
  readonly referenceClock: InstrumentFigures;
  readonly link: InstrumentFigures | null;
  readonly analysis: SeriesAnalysis | null;
  readonly analysisState: HeightResultView["analysis"];
  readonly adjustment: AdjustmentView | null;
  readonly now: Date;
}

type Named = { name: string; value: number };
type Levelled = NonNullable<HeightResultView["levelled"]>;

const quadrature = (values: readonly number[]) => Math.sqrt(values.reduce((s, v) => s + v * v, 0));

function instrumentsOf(input: HeightResultInput): InstrumentFigures[] {
  const { remoteClock, referenceClock, link } = input;
  return link === null ? [remoteClock, referenceClock] : [remoteClock, referenceClock, link];
}

/** One systematic row per instrument: its named terms in quadrature. */
function systematicTerms(input: HeightResultInput): Named[] {
  return instrumentsOf(input)
    .map((i) => ({
      name: `${i.name} systematic`,
      value: quadrature(i.systematic.map((t) => t.value)),
    }))
    .filter((t) => t.value > 0);
}

function levelledOf(input: HeightResultInput): {
  levelled: Levelled | null;
  missing: string | null;
} {
  const { run, adjustment } = input;
  const none = (missing: string) => ({ levelled: null, missing });
  if (run.remoteMark === "")
    return none("The run names no remote mark, so there is nothing levelled to compare with.");
  if (adjustment === null)
    return none("No levelling adjustment has been computed for this campaign yet.");
  const point = adjustment.points.find((p) => p.mark === run.remoteMark);
  if (point === undefined) {
    const why = adjustment.unconnected.includes(run.remoteMark)
      ? "no levelling joins it to a benchmark"
      : "no levelling reaches it";
    return none(`Mark ${run.remoteMark} is not in the latest adjustment: ${why}.`);
  }
  if (run.referenceHeightM === null || run.referenceHeightSigmaM === null) {
    return none("The run has no reference height to subtract from the mark's height.");
  }
  // The largest published σ among the fixed points: conservative, since which benchmark carries
  // the remote mark's datum is not separated out of the adjustment.
  const benchmarkSigmaM = Math.max(
    0,
    ...adjustment.points.map((p) => (p.fixed ? (p.benchmarkSigmaM ?? 0) : 0)),
  );
  const tieSigmaM = point.sigmaM;
  return {
    missing: null,
    levelled: {
      mark: point.mark,
      markHeightM: point.heightM,
      tieSigmaM,
      benchmarkSigmaM,
      referenceHeightM: run.referenceHeightM,
      referenceHeightSigmaM: run.referenceHeightSigmaM,
      heightDifferenceM: point.heightM - run.referenceHeightM,
      sigmaM: quadrature([tieSigmaM, benchmarkSigmaM, run.referenceHeightSigmaM]),
      adjustmentId: adjustment.id,
      adjustedAt: adjustment.computedAt,
    },
  };
}

interface Inputs {
  core: TimeToTargetInput & { now: string; accumulatedS: number; uptime: number };
  source: "data" | "stated";
  instability: Named[];
  systematic: Named[];
  heights: Named[];
}

function coreInput(input: HeightResultInput, levelled: Levelled | null): Inputs {
  const { analysis, run, site } = input;
  const fit = analysis?.fit ?? null;
  const instability: Named[] =
    fit !== null
      ? [{ name: "comparison (fitted to the data)", value: fit.sigmaAt1s }]
      : instrumentsOf(input).map((i) => ({ name: i.name, value: i.instabilityAt1s }));
  const systematic = systematicTerms(input);
  const heights: Named[] =
    levelled === null
      ? []
      : [
          { name: "levelling tie", value: levelled.tieSigmaM },
          { name: "benchmark", value: levelled.benchmarkSigmaM },
          { name: "reference height", value: levelled.referenceHeightSigmaM },
        ];
  const flicker = fit?.flickerFloor ?? null;
  return {
    source: fit !== null ? "data" : "stated",
    instability,
    systematic,
    heights,
    core: {
      targetHeightUncertaintyM: run.targetHeightUncertaintyM,
      instabilityAt1s: instability,
      ...(flicker !== null ? { flickerFloor: flicker } : {}),
      systematic,
      heightTermsM: heights,
      latitudeDeg: site.latitudeDeg,
      heightM: site.approxHeightM,
      accumulatedS: analysis?.validTimeS ?? 0,
      uptime: analysis?.uptime ?? run.plannedUptime,
      now: analysis?.lastAt ?? input.now.toISOString(),
    },
  };
}

/** The budget now (after accumulatedS), or its floor before any data; heights through c²/γ. */
function budgetRows(inputs: Inputs): BudgetRowView[] {
  const { core } = inputs;
  const mPerFractional = heightPerFractionalFrequency(core.latitudeDeg, core.heightM);
  const fractional = (term: string, kind: BudgetRowView["kind"], value: number): BudgetRowView => ({
    term,
    kind,
    fractional: value,
    heightM: value * mPerFractional,
  });
  const sigma1s = quadrature(inputs.instability.map((t) => t.value));
  const rows: BudgetRowView[] = [];
  if (core.accumulatedS > 0)
    rows.push(fractional("statistical", "statistical", sigma1s / Math.sqrt(core.accumulatedS)));
  if (core.flickerFloor !== undefined && core.flickerFloor > 0)
    rows.push(fractional("flicker floor", "flicker", core.flickerFloor));
  for (const s of inputs.systematic) rows.push(fractional(s.name, "systematic", s.value));
  const kinds = ["levelling-tie", "benchmark", "reference-height"] as const;
  inputs.heights.forEach((h, i) =>
    rows.push({
      term: h.name,
      kind: kinds[i] ?? "benchmark",
      fractional: h.value / mPerFractional,
      heightM: h.value,
    }),
  );
  return rows;
}

export function computeHeightResult(input: HeightResultInput): HeightResultView {
  const { run, analysis } = input;
  const { levelled, missing } = levelledOf(input);
  const inputs = coreInput(input, levelled);
  const { core } = inputs;
  const budget = budgetRows(inputs);
  const combinedHeightUncertaintyM = quadrature(budget.map((r) => r.heightM));
  const nowM = core.accumulatedS > 0 ? heightUncertaintyAt(core, core.accumulatedS) : null;
  const clock =
    analysis === null || nowM === null
      ? null
      : (() => {
          const h = heightDifferenceFromFrequency({
            fractionalFrequency: analysis.meanFractional,
            latitudeDeg: input.site.latitudeDeg,
            heightM: run.referenceHeightM ?? 0,
          });
          return {
            meanFractional: analysis.meanFractional,
            geopotentialDifference: h.geopotentialDifference,
            heightDifferenceM: h.heightDifference,
            sigmaM: nowM,
          };
        })();
  const comparison =
    clock === null || levelled === null
      ? null
      : (() => {
          const differenceM = clock.heightDifferenceM - levelled.heightDifferenceM;
          const z = Math.abs(differenceM) / combinedHeightUncertaintyM;
          return { differenceM, sigmaM: combinedHeightUncertaintyM, z, consistent: z <= 1.96 };
        })();
  const t = timeToTarget(core);
  const why = t.reachable ? null : explainUnreachable(t, run.targetHeightUncertaintyM);
  return {
    runId: run.id,
    dataRevision: run.dataRevision,
    analysis: input.analysisState,
    clock,
    budget,
    combinedHeightUncertaintyM,
    levelled,
    levelledMissing: missing,
    comparison,
    timeToTarget: {
      input: {
        targetHeightUncertaintyM: core.targetHeightUncertaintyM,
        instabilityAt1s: inputs.instability,
        ...(core.flickerFloor !== undefined ? { flickerFloor: core.flickerFloor } : {}),
        systematic: inputs.systematic,
        heightTermsM: inputs.heights,
        latitudeDeg: core.latitudeDeg,
        heightM: core.heightM,
        accumulatedS: core.accumulatedS,
        uptime: core.uptime,
        now: core.now,
      },
      instabilitySource: inputs.source,
      reachable: t.reachable,
      neededS: t.neededS,
      leftS: t.leftS,
      wallClockLeftS: t.wallClockLeftS,
      eta: t.eta,
      floorM: t.floorM,
      dominant: t.dominant,
      nowM,
      reason: why?.reason ?? null,
      improve: why?.improve ?? null,
    },
    caution: officialHeightsCaution,
    computedAt: input.now.toISOString(),
  };
}
