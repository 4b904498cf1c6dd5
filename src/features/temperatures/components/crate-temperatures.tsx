// A crate's temperatures at a site: choose the crate, see its merged series against its band with
// the statistics beside it, and add a reading by hand.
import { useMemo, useState } from "react";
import type { CrateView } from "../../../../shared/schemas/crates";
import { LinkButton } from "../../../components/button";
import { SelectField } from "../../../components/form-field";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import type { LocalFieldEntry } from "../../../db/database";
import { useSiteTemperatures } from "../hooks/use-temperatures";
import { mergeTemperatureEntries, seriesStatistics } from "../series";
import { ManualReadingForm } from "./manual-reading-form";
import { TemperatureChart } from "./temperature-chart";
import { TemperatureStats } from "./temperature-stats";

export interface CrateTemperaturesProps {
  campaignId: string;
  siteId: string;
  /** can(role, "entry.record"): shows the manual form and the import link. */
  canRecord: boolean;
  /** The import screen for temperatures at this site (paths.entryImport). */
  importHref?: string;
  /** The crate to show first, e.g. from the address. */
  initialCrateId?: string;
}

function CrateSeries({
  crate,
  entries,
}: {
  crate: CrateView;
  entries: readonly LocalFieldEntry[];
}) {
  const band = useMemo(
    () => ({ minC: crate.temperatureMinC, maxC: crate.temperatureMaxC }),
    [crate.temperatureMinC, crate.temperatureMaxC],
  );
  const merged = useMemo(() => mergeTemperatureEntries(entries, crate.id), [entries, crate.id]);
  const stats = useMemo(() => seriesStatistics(merged.samples, band), [merged.samples, band]);
  const pending = entries.some((e) => e.crateId === crate.id && e.pending);

  if (merged.samples.length === 0)
    return (
      <Notice title="No temperatures yet">
        Nothing recorded for {crate.label} at this site. Import a logger file or add a reading by
        hand.
      </Notice>
    );
  const description =
    stats === null
      ? `Temperatures of ${crate.label}`
      : `Temperatures of ${crate.label}: ${merged.samples.length} readings from ${stats.statistics.minC.toFixed(1)} to ${stats.statistics.maxC.toFixed(1)} °C against ${band.minC} … ${band.maxC} °C`;
  return (
    <div className="flex flex-col gap-3">
      <p className="flex flex-wrap items-center gap-3 text-muted tabular-nums">
        <span>
          {merged.samples.length.toLocaleString("en-GB")} readings from {merged.entries}{" "}
          {merged.entries === 1 ? "entry" : "entries"} · allowed {band.minC} … {band.maxC} °C
        </span>
        {pending && <PendingMark />}
      </p>
      {merged.duplicates > 0 && (
        <Notice tone="attention" title="Readings recorded twice">
          {merged.duplicates} readings share their time with a newer one and are left out; the newer
          one counts.
        </Notice>
      )}
      {!(band.maxC > band.minC) && (
        <Notice tone="attention" title="No usable band">
          The crate's band ({band.minC} … {band.maxC} °C) is empty, so nothing is compared against
          it.
        </Notice>
      )}
      <div className="grid gap-6 lg:grid-cols-[minmax(0,2fr)_minmax(16rem,1fr)]">
        <TemperatureChart
          samples={merged.samples}
          band={band}
          maxGapS={stats?.maxGapS}
          description={description}
        />
        {stats !== null && (
          <TemperatureStats statistics={stats.statistics} maxGapS={stats.maxGapS} />
        )}
      </div>
    </div>
  );
}

export function CrateTemperatures({
  campaignId,
  siteId,
  canRecord,
  importHref,
  initialCrateId,
}: CrateTemperaturesProps) {
  const { crates, entries } = useSiteTemperatures(campaignId, siteId);
  const [chosen, setChosen] = useState(initialCrateId ?? "");
  if (crates === undefined || entries === undefined)
    return <Loading label="Reading the temperatures on this device…" />;
  if (crates.length === 0)
    return (
      <Notice tone="attention" title="No crates on this device">
        Sync once so this device knows the campaign's crates.
      </Notice>
    );
  const crate = crates.find((c) => c.id === chosen) ?? crates[0];
  if (crate === undefined) return null;
  return (
    <div className="flex flex-col gap-6">
      <div className="flex flex-wrap items-end gap-4">
        <div className="min-w-64">
          <SelectField label="Crate" value={crate.id} onChange={(e) => setChosen(e.target.value)}>
            {crates.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label} ({c.temperatureMinC} … {c.temperatureMaxC} °C)
              </option>
            ))}
          </SelectField>
        </div>
        {canRecord && importHref !== undefined && (
          <LinkButton to={importHref}>Import a logger file…</LinkButton>
        )}
      </div>
      <CrateSeries crate={crate} entries={entries} />
      {canRecord && (
        <ManualReadingForm
          key={crate.id}
          campaignId={campaignId}
          siteId={siteId}
          crateId={crate.id}
        />
      )}
    </div>
  );
}
