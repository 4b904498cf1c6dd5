import { PageHeader } from "../../components/page-header";

export function BenchmarksRoute() {
  return <PageHeader title="BenchmarksRoute" />;
}
