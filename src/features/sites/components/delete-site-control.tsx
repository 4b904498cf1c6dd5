import { useState } from "react";
import type { SiteView } from "../../../../shared/schemas";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useDeleteSite } from "../api/delete-site";

interface DeleteSiteControlProps {
  campaignId: string;
  site: SiteView;
  onDeleted: () => void;
}

/** Two steps, so that a gloved tap never deletes by accident. */
export function DeleteSiteControl({ campaignId, site, onDeleted }: DeleteSiteControlProps) {
  const [confirming, setConfirming] = useState(false);
  const deleteSite = useDeleteSite(campaignId);

  if (!confirming) {
    return (
      <Button tone="danger" onClick={() => setConfirming(true)}>
        Delete site…
      </Button>
    );
  }
  return (
    <div className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-surface p-4">
      <p className="font-semibold">Delete “{site.name}”?</p>
      <p className="text-muted">
        It leaves the campaign’s lists for everyone. The server keeps a deleted record for the audit
        trail.
      </p>
      {deleteSite.isError && (
        <Notice tone="danger" title="Not deleted" live>
          {messageOf(deleteSite.error)}
        </Notice>
      )}
      <div className="flex flex-wrap gap-3">
        <Button
          tone="danger"
          disabled={deleteSite.isPending}
          onClick={() => deleteSite.mutate(site.id, { onSuccess: onDeleted })}
        >
          {deleteSite.isPending ? "Deleting…" : "Yes, delete"}
        </Button>
        <Button onClick={() => setConfirming(false)}>Keep the site</Button>
      </div>
    </div>
  );
}
