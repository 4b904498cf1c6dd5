// The site this tablet is at, per campaign, remembered on the device so the crew's home opens there.
const key = (campaignId: string) => `equipot.currentSite.${campaignId}`;

export function readCurrentSite(campaignId: string): string | null {
  try {
    return localStorage.getItem(key(campaignId));
  } catch {
    return null;
  }
}

export function writeCurrentSite(campaignId: string, siteId: string | null): void {
  try {
    if (siteId === null) localStorage.removeItem(key(campaignId));
    else localStorage.setItem(key(campaignId), siteId);
  } catch {
    // Private browsing without storage: the choice lasts until the page closes.
  }
}
