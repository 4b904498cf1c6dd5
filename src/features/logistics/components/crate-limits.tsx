import type { CrateView } from "../../../../shared/schemas/crates";

/** A crate's limits and weight, with units, in tabular figures. */
export function CrateLimits({ crate }: { crate: CrateView }) {
  return (
    <span className="tabular-nums">
      Shock ≤ {crate.maxShockG} g · {crate.temperatureMinC} … {crate.temperatureMaxC} °C
      {crate.maxTiltDeg !== null && ` · tilt ≤ ${crate.maxTiltDeg}°`} · {crate.weightKg} kg
    </span>
  );
}
