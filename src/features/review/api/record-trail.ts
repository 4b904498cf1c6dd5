// The change history of one record (a site, a crate, …) from the audit trail.
import { queryOptions, useQuery } from "@tanstack/react-query";
import {
  trailResponse,
  type AuditEventView,
  type TrailEntity,
} from "../../../../shared/schemas/reviews";
import { apiRequest } from "../../../lib/api";
import { reviewKeys } from "./keys";

export async function getRecordTrail(
  campaignId: string,
  entity: TrailEntity,
  id: string,
  signal?: AbortSignal,
): Promise<AuditEventView[]> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/audit/${entity}/${encodeURIComponent(id)}`;
  return (await apiRequest(path, { schema: trailResponse, signal })).trail;
}

export function recordTrailQueryOptions(campaignId: string, entity: TrailEntity, id: string) {
  return queryOptions({
    queryKey: [...reviewKeys.all, "trail", campaignId, entity, id] as const,
    queryFn: ({ signal }) => getRecordTrail(campaignId, entity, id, signal),
  });
}

export function useRecordTrail(
  campaignId: string,
  entity: TrailEntity,
  id: string,
  enabled: boolean,
) {
  return useQuery({ ...recordTrailQueryOptions(campaignId, entity, id), enabled });
}
