// Local writes of sites, each recorded with its outbox entry in one transaction (see outbox.ts).
import type { SiteFormValues, SitePatch } from "../../shared/schemas/sites";
import { sitePatchSchema, siteFormSchema } from "../../shared/schemas/sites";
import type { MutationName } from "../../shared/sync/protocol";
import type { EquipotDb } from "./database";
import { recordMutation } from "./outbox";

const record = (
  db: EquipotDb,
  campaignId: string,
  name: MutationName,
  entityId: string,
  args: unknown,
) => recordMutation(db, { campaignId, name, entityId, args });

export async function createSiteLocally(
  db: EquipotDb,
  campaignId: string,
  values: SiteFormValues,
  id = crypto.randomUUID(),
) {
  const fields = siteFormSchema.parse(values);
  await record(db, campaignId, "site.create", id, { id, ...fields });
  return id;
}

/**
 * Sends only the fields that changed, each with the value the user saw (for the server's merge).
 * `seenBefore` holds the values shown when the form opened; without it the working copy's are taken.
 */
export async function updateSiteLocally(
  db: EquipotDb,
  campaignId: string,
  id: string,
  values: SitePatch,
  seenBefore?: SitePatch,
) {
  const current = await db.sites.get(id);
  if (!current || current.campaignId !== campaignId)
    throw new Error("This site is not on this device");
  const wanted = sitePatchSchema.parse(values);
  const changes: Record<string, unknown> = {};
  const base: Record<string, unknown> = {};
  for (const [field, value] of Object.entries(wanted)) {
    const seen = current[field as keyof SitePatch];
    if (value === undefined || value === seen) continue;
    changes[field] = value;
    base[field] = seenBefore?.[field as keyof SitePatch] ?? seen;
  }
  if (Object.keys(changes).length === 0) return false;
  await record(db, campaignId, "site.update", id, { id, changes, base });
  return true;
}

export async function deleteSiteLocally(db: EquipotDb, campaignId: string, id: string) {
  await record(db, campaignId, "site.delete", id, { id });
}

export async function resolveConflictLocally(
  db: EquipotDb,
  campaignId: string,
  conflictId: string,
  value: unknown,
) {
  const conflict = await db.conflicts.get(conflictId);
  if (!conflict) throw new Error("This conflict is not on this device");
  await recordMutation(
    db,
    {
      campaignId,
      name: "conflict.resolve",
      args: { id: conflictId, value },
      entityId: conflict.entityId,
      field: conflict.field,
    },
    {
      tables: [db.conflicts],
      write: () =>
        db.conflicts.update(conflictId, {
          resolvedAt: new Date().toISOString(),
          resolvedValue: value,
        }),
    },
  );
}
