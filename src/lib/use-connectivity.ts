import { useSyncExternalStore } from "react";
import { getConnectivity, subscribeConnectivity, type Connectivity } from "./connectivity";

export function useConnectivity(): Connectivity {
  return useSyncExternalStore(subscribeConnectivity, getConnectivity, getConnectivity);
}
