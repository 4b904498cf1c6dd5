// The office's decisions on this device's records, live.
import { useLiveQuery } from "dexie-react-hooks";
import { reviewOfRecord, sentBackRecords } from "../../../db/review-queries";
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
