// Dew point by the Magnus form with the constants of O. A. Alduchov and R. E. Eskridge,
// J. Appl. Meteor. 35 (1996) 601: a = 17.625, b = 243.04 °C, valid −40 … 60 °C (±0.35 °C).
// γ = ln(RH/100) + aT/(b + T), T_d = bγ/(a − γ).
import { ScienceInputError } from "../errors";
import { requireFinite, requireNonNegative, requirePositive, requireRange } from "../validate";

const A = 17.625;
const B_C = 243.04;
export const MAGNUS_VALID_RANGE_C = { min: -40, max: 60 } as const;

export function dewPoint(temperatureC: number, relativeHumidityPct: number): number {
  requireRange(temperatureC, "temperatureC", MAGNUS_VALID_RANGE_C.min, MAGNUS_VALID_RANGE_C.max);
  requireFinite(relativeHumidityPct, "relativeHumidityPct");
  if (!(relativeHumidityPct > 0 && relativeHumidityPct <= 100)) {
    throw new ScienceInputError(
      "relativeHumidityPct",
      `must be in (0, 100] %, got ${relativeHumidityPct}`,
    );
  }
  const g = Math.log(relativeHumidityPct / 100) + (A * temperatureC) / (B_C + temperatureC);
  return (B_C * g) / (A - g);
}

export interface UnpackingInput {
  /** Temperature of the coldest surface inside the crate, °C. */
  readonly surfaceTemperatureC: number;
  readonly roomTemperatureC: number;
  readonly roomRelativeHumidityPct: number;
  /** Required margin above the dew point, K. Default 3 K (common practice; the coatings rule of ISO 8502-4, memory). */
  readonly marginC?: number;
  /** Thermal time constant of the crate contents, s: T(t) = T_room + (T0 − T_room)·e^(−t/τ). */
  readonly timeConstantS?: number;
}

export type UnpackingStatus = "may-open" | "wait" | "wait-time-unknown" | "room-too-humid";

export interface UnpackingResult {
  readonly mayOpen: boolean;
  readonly status: UnpackingStatus;
  readonly dewPointC: number;
  /** Dew point plus margin: the surface must be at least this warm, °C. */
  readonly requiredSurfaceC: number;
  readonly marginC: number;
  /** Time to wait, s: 0 when it may open now; null when unknown or never at room conditions. */
  readonly waitS: number | null;
}

/** May the crate be opened without condensation on its contents; if not, how long to wait. */
export function unpackingCheck(input: UnpackingInput): UnpackingResult {
  const surface = requireRange(input.surfaceTemperatureC, "surfaceTemperatureC", -60, 90);
  const room = requireRange(
    input.roomTemperatureC,
    "roomTemperatureC",
    MAGNUS_VALID_RANGE_C.min,
    MAGNUS_VALID_RANGE_C.max,
  );
  const rh = requireFinite(input.roomRelativeHumidityPct, "roomRelativeHumidityPct");
  if (!(rh > 0 && rh <= 100)) {
    throw new ScienceInputError("roomRelativeHumidityPct", `must be in (0, 100] %, got ${rh}`);
  }
  const dewPointC = dewPoint(room, rh);
  const marginC = requireNonNegative(input.marginC ?? 3, "marginC");
  const requiredSurfaceC = dewPointC + marginC;
  const base = { dewPointC, requiredSurfaceC, marginC };
  if (surface >= requiredSurfaceC) return { mayOpen: true, status: "may-open", waitS: 0, ...base };
  // Warming toward the room temperature never passes it: the room itself is too close to its dew point.
  if (requiredSurfaceC >= room)
    return { mayOpen: false, status: "room-too-humid", waitS: null, ...base };
  if (input.timeConstantS === undefined)
    return { mayOpen: false, status: "wait-time-unknown", waitS: null, ...base };
  const tau = requirePositive(input.timeConstantS, "timeConstantS");
  const waitS = tau * Math.log((room - surface) / (room - requiredSurfaceC));
  return { mayOpen: false, status: "wait", waitS, ...base };
}
