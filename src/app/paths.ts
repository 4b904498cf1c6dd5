// Every in-app address, built in one place.
const campaign = (campaignId: string) => `/campaigns/${encodeURIComponent(campaignId)}`;

export const paths = {
  home: "/",
  signIn: "/sign-in",
  invite: (token: string) => `/invite/${encodeURIComponent(token)}`,
  campaigns: "/campaigns",
  campaign,
  sites: (campaignId: string) => `${campaign(campaignId)}/sites`,
  newSite: (campaignId: string) => `${campaign(campaignId)}/sites/new`,
  editSite: (campaignId: string, siteId: string) =>
    `${campaign(campaignId)}/sites/${encodeURIComponent(siteId)}/edit`,
  checklistRun: (campaignId: string, runId: string) =>
    `${campaign(campaignId)}/checklists/${encodeURIComponent(runId)}`,
  members: (campaignId: string) => `${campaign(campaignId)}/members`,
  conflicts: (campaignId: string) => `${campaign(campaignId)}/conflicts`,
  device: "/device",
} as const;
