// The statistics of a crate's series against its band, all from the science core
// (temperatureStatistics): time-weighted, linear between readings, gaps never bridged.
import type { TemperatureStatistics } from "../../../../shared/science/transport/temperature";
import { StatusShape } from "../../../components/status-shape";
import { formatUtc } from "../../../lib/format";
import { formatHoursMinutes } from "../series";

const c = (v: number) => `${v.toFixed(1)} °C`.replace("-", "−");
const percent = (v: number) => `${(v * 100).toFixed(1)} %`;
const utcOf = (s: number) => formatUtc(new Date(s * 1000).toISOString());

function Row({ term, value }: { term: string; value: string }) {
  return (
    <div className="flex justify-between gap-4 border-b border-line py-2">
      <dt>{term}</dt>
      <dd className="text-right font-semibold tabular-nums">{value}</dd>
    </div>
  );
}

interface TemperatureStatsProps {
  statistics: TemperatureStatistics;
  maxGapS: number;
}

export function TemperatureStats({ statistics: s, maxGapS }: TemperatureStatsProps) {
  const outside = s.outsideS > 0;
  return (
    <section aria-label="Statistics" className="flex flex-col gap-3">
      <p className="flex items-center gap-2 font-semibold">
        <StatusShape
          shape={outside ? "octagon" : "disc"}
          className={outside ? "text-danger" : "text-primary"}
        />
        {outside ? "Outside the band for a while" : "Within the band throughout"}
      </p>
      <dl>
        <Row term="Readings" value={s.samples.toLocaleString("en-GB")} />
        <Row term="Lowest" value={c(s.minC)} />
        <Row term="Highest" value={c(s.maxC)} />
        <Row term="Mean (time-weighted)" value={c(s.meanC)} />
        <Row term="Mean kinetic temperature" value={c(s.meanKineticC)} />
        <Row term="Time outside the band (h:mm)" value={formatHoursMinutes(s.outsideS)} />
        <Row term="Share of the covered time" value={percent(s.fractionOutside)} />
        <Row term="Covered (h:mm)" value={formatHoursMinutes(s.coveredS)} />
      </dl>
      {s.gapS > 0 && (
        <p className="flex items-start gap-2 text-attention-ink">
          <StatusShape shape="triangle" className="mt-0.5 text-attention" />
          <span>
            Gaps: {formatHoursMinutes(s.gapS)} without readings (intervals longer than{" "}
            {formatHoursMinutes(maxGapS)} are not bridged and not counted above).
          </span>
        </p>
      )}
      {s.excursions.length > 0 && (
        <div>
          <h3 className="font-semibold">Excursions</h3>
          <ol className="mt-1 flex flex-col gap-1 tabular-nums">
            {s.excursions.map((e) => (
              <li key={`${e.side}-${e.startS}`} className="flex items-start gap-2">
                <StatusShape shape="octagon" className="mt-0.5 text-danger" />
                <span>
                  {e.side === "above" ? "Above" : "Below"} the band {utcOf(e.startS)} to{" "}
                  {utcOf(e.endS)} ({formatHoursMinutes(e.endS - e.startS)}),{" "}
                  {e.side === "above" ? "up to" : "down to"} {c(e.extremeC)}
                </span>
              </li>
            ))}
          </ol>
        </div>
      )}
    </section>
  );
}
