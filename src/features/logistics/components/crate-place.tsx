import type { CratePlace } from "../../../db/logistics-queries";

/** "At Valley lab", "On the way to Ridge hut", or that no leg has placed it yet. */
export function describePlace(place: CratePlace, siteName: (id: string) => string): string {
  if (place.kind === "at") return `At ${siteName(place.siteId)}`;
  if (place.kind === "moving") return `On the way to ${siteName(place.toSiteId)}`;
  return "No arrival recorded yet";
}
