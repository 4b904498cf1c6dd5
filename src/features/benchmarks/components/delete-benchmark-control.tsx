import type { BenchmarkView } from "../../../../shared/schemas/benchmarks";
import { ConfirmDelete } from "../../../components/confirm-delete";
import { useDeleteBenchmark } from "../api/delete-benchmark";

interface Props {
  campaignId: string;
  benchmark: BenchmarkView;
  onDeleted: () => void;
}

export function DeleteBenchmarkControl({ campaignId, benchmark, onDeleted }: Props) {
  const removing = useDeleteBenchmark(campaignId);
  return (
    <ConfirmDelete
      label="Delete benchmark…"
      question={`Delete benchmark ${benchmark.code}?`}
      pending={removing.isPending}
      error={removing.error}
      onConfirm={() => removing.mutate(benchmark.id, { onSuccess: onDeleted })}
    >
      It leaves the campaign’s list and is no longer a fixed point of the network’s next adjustment.
      Results already kept stay as they were computed.
    </ConfirmDelete>
  );
}
