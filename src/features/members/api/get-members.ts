import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { memberView, type MemberView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { memberKeys } from "./keys";

const membersResponse = z.object({ members: z.array(memberView) });

export async function getMembers(campaignId: string, signal?: AbortSignal): Promise<MemberView[]> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/members`;
  const { members } = await apiRequest(path, { schema: membersResponse, signal });
  return members;
}

export function membersQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: memberKeys.list(campaignId),
    queryFn: ({ signal }) => getMembers(campaignId, signal),
  });
}

export function useMembers(campaignId: string) {
  return useQuery(membersQueryOptions(campaignId));
}
