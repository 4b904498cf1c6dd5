import { PageHeader } from "../../components/page-header";

export function RunRoute() {
  return <PageHeader title="RunRoute" />;
}
