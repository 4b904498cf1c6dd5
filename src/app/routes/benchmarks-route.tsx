// The campaign's benchmarks with their published heights: the list (read from the persisted cache
// offline), and for geodesists the add/edit form, delete and the file import.
import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { can } from "../../../shared/permissions";
import type { BenchmarkView } from "../../../shared/schemas/benchmarks";
import { officialHeightsCaution } from "../../../shared/schemas/comparison";
import { useBenchmarks } from "../../features/benchmarks/api/list-benchmarks";
import { BenchmarkForm } from "../../features/benchmarks/components/benchmark-form";
import { BenchmarkTable } from "../../features/benchmarks/components/benchmark-table";
import { DeleteBenchmarkControl } from "../../features/benchmarks/components/delete-benchmark-control";
import { ImportPanel } from "../../features/benchmarks/components/import-panel";
import { comparisonKeys } from "../../features/comparison/api/keys";
import { Button, LinkButton } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { messageOf } from "../../lib/api-error";
import { useConnectivity } from "../../lib/use-connectivity";
import { useCampaign } from "../layouts/campaign-layout";
import { paths } from "../paths";

type Editing = { benchmark: BenchmarkView | null } | null;

export function BenchmarksRoute() {
  const { campaignId, role } = useCampaign();
  const manage = can(role, "benchmark.manage");
  const online = useConnectivity() === "online";
  const benchmarks = useBenchmarks(campaignId);
  const queryClient = useQueryClient();
  const [editing, setEditing] = useState<Editing>(null);
  const [saved, setSaved] = useState<string | null>(null);
  const list = benchmarks.data;
  // Height results read the benchmarks' σ on every request: let them be asked again.
  const done = (message: string) => {
    setEditing(null);
    setSaved(message);
    void queryClient.invalidateQueries({ queryKey: comparisonKeys.all });
  };
  const open = (benchmark: BenchmarkView | null) => {
    setSaved(null);
    setEditing({ benchmark });
  };
  const current = editing?.benchmark ?? null;
  return (
    <>
      <PageHeader
        title="Benchmarks"
        lead="Marks of the height network with their published heights"
        actions={
          <>
            {manage && editing === null && (
              <Button tone="primary" onClick={() => open(null)}>
                Add benchmark
              </Button>
            )}
            <LinkButton to={paths.heights(campaignId)}>Heights</LinkButton>
          </>
        }
      />
      <div className="flex flex-col gap-8">
        <Notice tone="attention" title="Campaign results">
          {officialHeightsCaution}
        </Notice>
        {saved !== null && (
          <Notice tone="info" title="Saved" live>
            {saved}
          </Notice>
        )}
        {manage && editing !== null && !online && (
          <Notice tone="attention" title="Needs a connection">
            Benchmarks are edited online. The list still reads offline; try again when this device
            has a network.
          </Notice>
        )}
        {manage && editing !== null && online && (
          <div className="flex flex-col gap-3">
            <BenchmarkForm
              key={current?.id ?? "new"}
              campaignId={campaignId}
              benchmark={current}
              like={list?.[0]}
              onSaved={(b) => done(`Benchmark ${b.code} saved.`)}
              onCancel={() => setEditing(null)}
            />
            {current !== null && (
              <DeleteBenchmarkControl
                campaignId={campaignId}
                benchmark={current}
                onDeleted={() => done(`Benchmark ${current.code} deleted.`)}
              />
            )}
          </div>
        )}
        <section aria-labelledby="benchmarks-heading" className="flex flex-col gap-3">
          <h2 id="benchmarks-heading" className="text-xl font-semibold">
            {list === undefined ? "Benchmarks" : `Benchmarks (${list.length})`}
          </h2>
          {benchmarks.isPending ? (
            <Loading label="Reading the benchmarks…" />
          ) : list === undefined ? (
            <Notice tone="danger" title="Benchmarks not available">
              {messageOf(benchmarks.error)}
            </Notice>
          ) : (
            <BenchmarkTable benchmarks={list} onEdit={manage ? open : null} />
          )}
        </section>
        {manage && <ImportPanel campaignId={campaignId} />}
      </div>
    </>
  );
}
