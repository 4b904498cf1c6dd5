// A printable label for one crate: the QR code, the label large enough to read across a hold, and
// what a handler needs before lifting it. Printed one per page (the print: variants hide the rest).
import { useMemo } from "react";
import type { CrateView } from "../../../shared/schemas/crates";
import { StatusShape } from "../../components/status-shape";
import { crateQrMatrix, encodeCrateCode, qrPath } from "./crate-code";

// Above this a crate is a team lift in most manual-handling guidance (common practice; local rules decide).
export const teamLiftKg = 25;

const quietZone = 4;

export function CrateQrCode({ label, className }: { label: string; className?: string }) {
  const { path, side } = useMemo(() => {
    const matrix = crateQrMatrix(label);
    return { path: qrPath(matrix, quietZone), side: matrix.size + 2 * quietZone };
  }, [label]);
  return (
    <svg
      viewBox={`0 0 ${side} ${side}`}
      role="img"
      aria-label={`QR code for crate ${label} (${encodeCrateCode(label)})`}
      shapeRendering="crispEdges"
      className={className}
      data-testid="crate-qr"
    >
      {/* Always black on white, whatever the theme: scanners need the contrast. */}
      <rect width={side} height={side} fill="#ffffff" />
      <path d={path} fill="#000000" />
    </svg>
  );
}

export function CrateLabel({ crate }: { crate: CrateView }) {
  const teamLift = crate.weightKg > teamLiftKg;
  return (
    <article
      aria-label={`Label for crate ${crate.label}`}
      className="flex flex-col gap-4 rounded-lg border-4 border-ink bg-white p-6 text-black print:break-after-page print:rounded-none print:border-0 print:p-0"
    >
      <div className="flex flex-wrap items-start gap-6">
        <CrateQrCode
          label={crate.label}
          className="h-56 w-56 shrink-0 print:h-[70mm] print:w-[70mm]"
        />
        <div className="flex min-w-0 flex-1 flex-col gap-2">
          <p className="text-sm font-semibold tracking-wide uppercase">Equipot crate</p>
          <p className="text-6xl font-bold tracking-tight break-words print:text-[28mm] print:leading-none">
            {crate.label}
          </p>
          <p className="text-xl">{crate.contents}</p>
          {crate.instrument !== "" && <p>Instrument: {crate.instrument}</p>}
        </div>
      </div>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-lg tabular-nums sm:grid-cols-4">
        <div>
          <dt className="text-sm font-semibold">Weight</dt>
          <dd className="text-2xl font-semibold">{crate.weightKg} kg</dd>
        </div>
        <div>
          <dt className="text-sm font-semibold">Shock limit</dt>
          <dd className="text-2xl font-semibold">{crate.maxShockG} g</dd>
        </div>
        <div>
          <dt className="text-sm font-semibold">Temperature</dt>
          <dd className="text-2xl font-semibold">
            {crate.temperatureMinC} … {crate.temperatureMaxC} °C
          </dd>
        </div>
        {crate.maxTiltDeg !== null && (
          <div>
            <dt className="text-sm font-semibold">Tilt limit</dt>
            <dd className="text-2xl font-semibold">{crate.maxTiltDeg}°</dd>
          </div>
        )}
      </dl>
      {teamLift && (
        <p className="flex items-center gap-3 rounded-lg border-4 border-black p-3 text-2xl font-bold">
          <StatusShape shape="triangle" className="h-8 w-8 text-black" />
          Team lift — {crate.weightKg} kg. Follow local manual-handling rules and the site&apos;s
          safety officer.
        </p>
      )}
      {crate.notes !== "" && <p className="text-lg">{crate.notes}</p>}
    </article>
  );
}
