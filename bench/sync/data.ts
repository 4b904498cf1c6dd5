// Invented demo sites for the sync benchmark: deterministic, valid for the site schema.
import { siteKinds, type SiteFormValues } from "../../shared/schemas/sites";

export function benchSite(i: number): SiteFormValues {
  return {
    name: `Survey mark ${i}`,
    kind: siteKinds[i % siteKinds.length] ?? "other",
    latitudeDeg: -60 + ((i * 7919) % 120_000) / 1000,
    longitudeDeg: -170 + ((i * 104_729) % 340_000) / 1000,
    approxHeightM: (i * 37) % 4000,
    notes: `Invented site ${i} for the sync benchmark: no real place.`,
  };
}

/** The same values as SQL, for seeding the server directly (g is the generate_series index). */
export const benchSiteSql = {
  name: `'Survey mark ' || g`,
  kind: `(enum_range(null::site_kind))[g % ${siteKinds.length} + 1]`,
  latitudeDeg: `-60 + ((g * 7919) % 120000) / 1000.0`,
  longitudeDeg: `-170 + ((g::bigint * 104729) % 340000) / 1000.0`,
  approxHeightM: `(g * 37) % 4000`,
  notes: `'Invented site ' || g || ' for the sync benchmark: no real place.'`,
};
