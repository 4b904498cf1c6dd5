import { DevicePanel } from "../../features/sync/components/device-panel";
import { PageHeader } from "../../components/page-header";
import { ForgetDeviceControl } from "../forget-device-control";

export function DeviceRoute() {
  return (
    <>
      <PageHeader
        title="This device"
        lead="What this tablet keeps for you, and how to save a copy of it."
      />
      <DevicePanel />
      <div className="mt-10 max-w-3xl border-t-2 border-line pt-6">
        <ForgetDeviceControl />
      </div>
    </>
  );
}
