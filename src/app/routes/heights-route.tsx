import { PageHeader } from "../../components/page-header";

export function HeightsRoute() {
  return <PageHeader title="HeightsRoute" />;
}
