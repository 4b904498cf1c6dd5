import { PageHeader } from "../../components/page-header";

export function HeightNetworkRoute() {
  return <PageHeader title="HeightNetworkRoute" />;
}
