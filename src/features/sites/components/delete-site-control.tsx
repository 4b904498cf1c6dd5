import { useState } from "react";
import type { SiteView } from "../../../../shared/schemas";
import { Button } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useSiteWrites } from "../hooks/use-local-sites";

interface DeleteSiteControlProps {
  campaignId: string;
  site: SiteView;
  onDeleted: () => void;
}

/** Two steps, so that a gloved tap never deletes by accident. */
export function DeleteSiteControl({ campaignId, site, onDeleted }: DeleteSiteControlProps) {
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<unknown>(null);
  const writes = useSiteWrites(campaignId);

  if (!confirming) {
    return (
      <Button tone="danger" onClick={() => setConfirming(true)}>
        Delete site…
      </Button>
    );
  }
  const remove = async () => {
    setBusy(true);
    setError(null);
    try {
      await writes.remove(site.id);
      onDeleted();
    } catch (caught) {
      setError(caught);
      setBusy(false);
    }
  };
  return (
    <div className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-surface p-4">
      <p className="font-semibold">Delete “{site.name}”?</p>
      <p className="text-muted">
        It leaves the campaign’s lists for everyone once sent. The server keeps a deleted record for
        the audit trail.
      </p>
      {error !== null && (
        <Notice tone="danger" title="Not deleted" live>
          {messageOf(error)}
        </Notice>
      )}
      <div className="flex flex-wrap gap-3">
        <Button tone="danger" disabled={busy} onClick={() => void remove()}>
          {busy ? "Deleting…" : "Yes, delete"}
        </Button>
        <Button onClick={() => setConfirming(false)}>Keep the site</Button>
      </div>
    </div>
  );
}
