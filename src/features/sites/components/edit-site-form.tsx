import { useState } from "react";
import type { SiteFormValues, SitePatch, SiteView } from "../../../../shared/schemas";
import { useSiteWrites } from "../hooks/use-local-sites";
import { SiteForm, type SiteFormDirty, type SiteFormOutput } from "./site-form";

interface EditSiteFormProps {
  campaignId: string;
  site: SiteView;
  cancelHref: string;
  /** Called once the change is committed on this device (or when nothing changed). */
  onSaved: (name: string, changed: boolean) => void;
}

const editable = ["name", "kind", "latitudeDeg", "longitudeDeg", "approxHeightM", "notes"] as const;

function valuesOf(site: SiteView): SiteFormValues & SitePatch {
  const { name, kind, latitudeDeg, longitudeDeg, approxHeightM, notes } = site;
  return { name, kind, latitudeDeg, longitudeDeg, approxHeightM, notes };
}

/** Only the fields the person touched, so that edits of other fields by others merge. */
function touchedOf(values: SiteFormOutput, dirty: SiteFormDirty): SitePatch {
  const changes: SitePatch = {};
  for (const field of editable) {
    if (dirty[field] === true) Object.assign(changes, { [field]: values[field] });
  }
  return changes;
}

export function EditSiteForm({ campaignId, site, cancelHref, onSaved }: EditSiteFormProps) {
  const writes = useSiteWrites(campaignId);
  // What the person saw when the form opened: the base of each change for the server's merge.
  // A sync arriving meanwhile does not reset what they are typing.
  const [seen] = useState(() => valuesOf(site));

  const save = async (values: SiteFormOutput, dirty: SiteFormDirty) => {
    const changed = await writes.update(site.id, touchedOf(values, dirty), seen);
    onSaved(values.name, changed);
  };

  return (
    <SiteForm
      defaultValues={seen}
      submitLabel="Save changes"
      cancelHref={cancelHref}
      onSave={save}
    />
  );
}
