import { DevicePanel } from "../../features/sync/components/device-panel";
import { PageHeader } from "../../components/page-header";

export function DeviceRoute() {
  return (
    <>
      <PageHeader
        title="This device"
        lead="What this tablet keeps for you, and how to save a copy of it."
      />
      <DevicePanel />
    </>
  );
}
