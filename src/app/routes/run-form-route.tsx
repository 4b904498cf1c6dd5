import { PageHeader } from "../../components/page-header";

export function RunNewRoute() {
  return <PageHeader title="New run" />;
}

export function RunEditRoute() {
  return <PageHeader title="Edit run" />;
}
