// Section and loop misclosures against k·√K mm, K the one-way length in km. The classes are data:
// other countries and standards use other k; a campaign may pass its own list.
import { ScienceInputError } from "../errors";
import { requireFinite, requireName, requireNonEmpty, requirePositive } from "../validate";

export interface LevellingClass {
  readonly id: string;
  readonly name: string;
  /** k for a section (forward − backward), mm per √km. */
  readonly sectionKMm: number;
  /** k for a loop or a line between marks, mm per √km. */
  readonly loopKMm: number;
  readonly source: string;
}

const FGCC = "FGCC 1984, Standards and Specifications for Geodetic Control Networks";

/** Default classes. First-order values are recalled from memory (not re-read in the source). */
export const FGCC_1984_LEVELLING_CLASSES: readonly LevellingClass[] = [
  // memory
  {
    id: "fgcc-1984-first-order-class-i",
    name: "First-order, Class I",
    sectionKMm: 3,
    loopKMm: 4,
    source: FGCC,
  },
  // memory
  {
    id: "fgcc-1984-first-order-class-ii",
    name: "First-order, Class II",
    sectionKMm: 4,
    loopKMm: 5,
    source: FGCC,
  },
  {
    id: "fgcc-1984-second-order-class-i",
    name: "Second-order, Class I",
    sectionKMm: 6,
    loopKMm: 6,
    source: FGCC,
  },
  {
    id: "fgcc-1984-second-order-class-ii",
    name: "Second-order, Class II",
    sectionKMm: 8,
    loopKMm: 8,
    source: FGCC,
  },
  { id: "fgcc-1984-third-order", name: "Third-order", sectionKMm: 12, loopKMm: 12, source: FGCC },
];

export function findLevellingClass(
  id: string,
  classes: readonly LevellingClass[] = FGCC_1984_LEVELLING_CLASSES,
): LevellingClass {
  const found = classes.find((c) => c.id === id);
  if (found === undefined) {
    throw new ScienceInputError(
      "class",
      `unknown levelling class "${id}"; known: ${classes.map((c) => c.id).join(", ")}`,
    );
  }
  return found;
}

function checkClass(c: LevellingClass): void {
  requireName(c.id, "class.id");
  requirePositive(c.sectionKMm, "class.sectionKMm");
  requirePositive(c.loopKMm, "class.loopKMm");
}

/** Allowed misclosure k·√K, in metres. */
export function misclosureToleranceM(
  c: LevellingClass,
  lengthKm: number,
  kind: "section" | "loop",
): number {
  checkClass(c);
  requirePositive(lengthKm, "lengthKm");
  const k = kind === "section" ? c.sectionKMm : c.loopKMm;
  return (k * Math.sqrt(lengthKm)) / 1000;
}

export interface MisclosureCheck {
  readonly misclosureM: number;
  readonly lengthKm: number;
  readonly toleranceM: number;
  readonly withinTolerance: boolean;
  /** |misclosure| / tolerance: above 1 fails. */
  readonly usedFraction: number;
}

function verdict(misclosureM: number, lengthKm: number, toleranceM: number): MisclosureCheck {
  const usedFraction = Math.abs(misclosureM) / toleranceM;
  return { misclosureM, lengthKm, toleranceM, withinTolerance: usedFraction <= 1, usedFraction };
}

/**
 * Section misclosure: the forward run A→B and the backward run B→A (each with the sign measured)
 * should sum to zero.
 */
export function sectionMisclosure(
  run: {
    readonly forwardDeltaM: number;
    readonly backwardDeltaM: number;
    readonly lengthKm: number;
  },
  c: LevellingClass,
): MisclosureCheck {
  const f = requireFinite(run.forwardDeltaM, "forwardDeltaM");
  const b = requireFinite(run.backwardDeltaM, "backwardDeltaM");
  return verdict(f + b, run.lengthKm, misclosureToleranceM(c, run.lengthKm, "section"));
}

/** Loop misclosure: the height differences around a closed loop should sum to zero. */
export function loopMisclosure(
  legs: readonly { readonly deltaM: number; readonly lengthKm: number }[],
  c: LevellingClass,
): MisclosureCheck {
  requireNonEmpty(legs, "legs");
  let sum = 0;
  let length = 0;
  legs.forEach((leg, i) => {
    sum += requireFinite(leg.deltaM, `legs[${i}].deltaM`);
    length += requirePositive(leg.lengthKm, `legs[${i}].lengthKm`);
  });
  return verdict(sum, length, misclosureToleranceM(c, length, "loop"));
}
