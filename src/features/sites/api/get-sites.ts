import { queryOptions, useQuery } from "@tanstack/react-query";
import { z } from "zod";
import { siteView, type SiteView } from "../../../../shared/schemas";
import { apiRequest } from "../../../lib/api";
import { siteKeys } from "./keys";

const sitesResponse = z.object({ sites: z.array(siteView) });

export async function getSites(campaignId: string, signal?: AbortSignal): Promise<SiteView[]> {
  const path = `/campaigns/${encodeURIComponent(campaignId)}/sites`;
  const { sites } = await apiRequest(path, { schema: sitesResponse, signal });
  return sites;
}

export function sitesQueryOptions(campaignId: string) {
  return queryOptions({
    queryKey: siteKeys.list(campaignId),
    queryFn: ({ signal }) => getSites(campaignId, signal),
  });
}

const byName = (a: SiteView, b: SiteView) => a.name.localeCompare(b.name);

export function useSites(campaignId: string) {
  return useQuery({ ...sitesQueryOptions(campaignId), select: (sites) => sites.toSorted(byName) });
}

/** One site, read from the campaign's list (the list is what is cached for offline use). */
export function useSite(campaignId: string, siteId: string) {
  return useQuery({
    ...sitesQueryOptions(campaignId),
    select: (sites) => sites.find((site) => site.id === siteId) ?? null,
  });
}
