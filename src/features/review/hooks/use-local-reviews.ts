// The office's decisions on this device's records, live.
import { useLiveQuery } from "dexie-react-hooks";
import { approvedRecordIds, reviewOfRecord, sentBackRecords } from "../../../db/review-queries";
import { useLocalSync } from "../../../lib/sync-context";

/** undefined while reading; null when the office has not decided on the record. */
export function useRecordReview(campaignId: string, subjectId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => reviewOfRecord(db, campaignId, subjectId), [db, campaignId, subjectId]);
}

export function useSentBack(campaignId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => sentBackRecords(db, campaignId), [db, campaignId]);
}

/** Ids of this campaign's approved records: their controls stay hidden. */
export function useApprovedIds(campaignId: string) {
  const { db } = useLocalSync();
  return useLiveQuery(() => approvedRecordIds(db, campaignId), [db, campaignId]);
}
