import { useState } from "react";
import {
  siteKindLabels,
  type SiteFormValues,
  type SiteUpdateInput,
  type SiteView,
} from "../../../../shared/schemas";
import { Notice } from "../../../components/notice";
import { isApiError } from "../../../lib/api-error";
import { useUpdateSite } from "../api/update-site";
import { SiteForm, type SiteFormDirty, type SiteFormOutput } from "./site-form";

interface EditSiteFormProps {
  campaignId: string;
  site: SiteView;
  cancelHref: string;
  onSaved: () => void;
}

const editable = ["name", "kind", "latitudeDeg", "longitudeDeg", "approxHeightM", "notes"] as const;
const labels: Record<(typeof editable)[number], string> = {
  name: "Name",
  kind: "Kind",
  latitudeDeg: "Latitude (°)",
  longitudeDeg: "Longitude (°)",
  approxHeightM: "Approximate height (m)",
  notes: "Notes",
};

function valuesOf(site: SiteView): SiteFormValues {
  const { name, kind, latitudeDeg, longitudeDeg, approxHeightM, notes } = site;
  return { name, kind, latitudeDeg, longitudeDeg, approxHeightM, notes };
}

/** Only the fields the person changed go to the server, so that edits to other fields merge. */
function changesOf(
  values: SiteFormOutput,
  dirty: SiteFormDirty,
  baseVersion: number,
): SiteUpdateInput {
  const changes: SiteUpdateInput = { baseVersion };
  for (const field of editable) {
    if (dirty[field] === true) Object.assign(changes, { [field]: values[field] });
  }
  return changes;
}

function ConflictNotice({ yours }: { yours: Partial<SiteFormOutput> }) {
  const entries = editable.filter((field) => yours[field] !== undefined);
  return (
    <Notice tone="attention" title="Changed by someone else" live>
      <p>
        This site was changed on the server after you opened it, so your edit was not saved. The
        form now shows the latest version. Check it and make your change again.
      </p>
      {entries.length > 0 && (
        <>
          <p className="mt-2 font-semibold">What you had entered:</p>
          <ul className="list-disc pl-6 tabular-nums">
            {entries.map((field) => (
              <li key={field}>
                {labels[field]}:{" "}
                {field === "kind" && yours.kind ? siteKindLabels[yours.kind] : String(yours[field])}
              </li>
            ))}
          </ul>
        </>
      )}
    </Notice>
  );
}

export function EditSiteForm({ campaignId, site, cancelHref, onSaved }: EditSiteFormProps) {
  const updateSite = useUpdateSite(campaignId, site.id);
  const [unsaved, setUnsaved] = useState<Partial<SiteFormOutput> | null>(null);

  const save = async (values: SiteFormOutput, dirty: SiteFormDirty) => {
    const changes = changesOf(values, dirty, site.version);
    if (Object.keys(changes).length === 1) return onSaved();
    try {
      await updateSite.mutateAsync(changes);
      onSaved();
    } catch (error) {
      if (!isApiError(error) || error.code !== "conflict") throw error;
      const { baseVersion: _base, ...yours } = changes;
      setUnsaved(yours);
    }
  };

  return (
    <SiteForm
      // A new version from the server remounts the form with its values.
      key={site.version}
      defaultValues={valuesOf(site)}
      submitLabel="Save changes"
      cancelHref={cancelHref}
      onSave={save}
      banner={unsaved !== null ? <ConflictNotice yours={unsaved} /> : undefined}
    />
  );
}
