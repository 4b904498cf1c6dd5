import type { ReactNode } from "react";
import { PersistQueryClientProvider } from "@tanstack/react-query-persist-client";
import { markCacheRestored, persistOptions, queryClient } from "../lib/query-client";

export function AppProviders({ children }: { children: ReactNode }) {
  return (
    <PersistQueryClientProvider
      client={queryClient}
      persistOptions={persistOptions}
      onSuccess={markCacheRestored}
      onError={markCacheRestored}
    >
      {children}
    </PersistQueryClientProvider>
  );
}
