// The campaign's crates from this device's store, live (pulled read-only with the campaign).
import { useLiveQuery } from "dexie-react-hooks";
import type { CrateView } from "../../../shared/schemas/crates";
import { listCrates } from "../../db/field-entry-queries";
import { useLocalSync } from "../../lib/sync-context";

/** undefined while reading. */
export function useLocalCrates(campaignId: string): CrateView[] | undefined {
  const { db } = useLocalSync();
  return useLiveQuery(() => listCrates(db, campaignId), [db, campaignId]);
}
