import { PageHeader } from "../../components/page-header";

export function InstrumentsRoute() {
  return <PageHeader title="Instruments" />;
}

export function InstrumentRoute() {
  return <PageHeader title="Instrument" />;
}
