import { useSyncExternalStore } from "react";
import { getDeviceStorage, subscribeDeviceStorage, type DeviceStorage } from "./device-storage";

export function useDeviceStorage(): DeviceStorage {
  return useSyncExternalStore(subscribeDeviceStorage, getDeviceStorage, getDeviceStorage);
}
