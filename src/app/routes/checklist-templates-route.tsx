import { useState } from "react";
import { useSearchParams } from "react-router-dom";
import { can } from "../../../shared/permissions";
import type { ChecklistTemplateView } from "../../../shared/schemas/checklists";
import { Button } from "../../components/button";
import { Loading } from "../../components/loading";
import { Notice } from "../../components/notice";
import { PageHeader } from "../../components/page-header";
import { useChecklistTemplates } from "../../features/checklist-templates/api/get-checklist-templates";
import { TemplateEditor } from "../../features/checklist-templates/components/template-editor";
import { TemplateList } from "../../features/checklist-templates/components/template-list";
import { messageOf } from "../../lib/api-error";
import { useConnectivity } from "../../lib/use-connectivity";
import { useCampaign } from "../layouts/campaign-layout";
import { NotAllowed } from "../not-allowed";
import { paths } from "../paths";

const newKey = "new";

/** Administrators keep the campaign's checklist templates here, online; tablets pull them. */
export function ChecklistTemplatesRoute() {
  const { campaignId, role } = useCampaign();
  const online = useConnectivity() === "online";
  const templates = useChecklistTemplates(campaignId);
  const [params, setParams] = useSearchParams();
  // A message after saving or deleting, shown only on the screen it belongs to.
  const [flash, setFlash] = useState<{
    at: string | null;
    version: number | null;
    title: string;
    text: string;
  } | null>(null);
  const editing = params.get("edit");
  const open = (id: string | null) => setParams(id === null ? {} : { edit: id });
  const base = paths.checklistTemplates(campaignId);

  if (!can(role, "checklist.template.write")) {
    return (
      <NotAllowed
        what="Checklist templates are kept by the campaign's administrators."
        backHref={paths.sites(campaignId)}
      />
    );
  }

  const offlineNotice = !online && (
    <Notice tone="attention" title="Offline" className="mb-6">
      Templates are edited with a connection. What you see here is the last copy this device
      fetched; saving works again once you are online.
    </Notice>
  );

  if (templates.data === undefined) {
    return (
      <>
        <PageHeader title="Checklist templates" />
        {offlineNotice}
        {templates.isError ? (
          <Notice tone="danger" title="Templates not loaded" live>
            {messageOf(templates.error)}
          </Notice>
        ) : templates.fetchStatus === "paused" ? null : (
          <Loading label="Loading templates…" />
        )}
      </>
    );
  }

  const list = templates.data;
  const reload = async (): Promise<ChecklistTemplateView | undefined> =>
    (await templates.refetch()).data?.find((t) => t.id === editing);
  const template = editing === newKey ? null : list.find((t) => t.id === editing);
  // Gone once the template moves on (another save, or a newer version loaded after a 409).
  const flashNotice = flash !== null &&
    flash.at === editing &&
    (flash.version === null || flash.version === template?.version) && (
      <Notice title={flash.title} live className="mb-6">
        {flash.text}
      </Notice>
    );

  if (editing !== null && template !== undefined) {
    return (
      <>
        <PageHeader
          title={template === null ? "New checklist template" : template.title}
          lead={
            template === null ? (
              "Items are copied into a run when it starts; later edits never change a run under way."
            ) : (
              <>
                Version <span className="tabular-nums">{template.version}</span>. Runs already
                started keep the items they began with.
              </>
            )
          }
        />
        {/* The editor says it beside its Save button, where it matters. */}
        {flashNotice}
        <TemplateEditor
          key={editing}
          campaignId={campaignId}
          template={template}
          online={online}
          reload={reload}
          onSaved={(saved, created) => {
            setFlash({
              at: saved.id,
              version: saved.version,
              title: "Saved",
              text: `“${saved.title}” is saved as version ${saved.version}. Tablets get it at their next sync.`,
            });
            if (created) open(saved.id);
          }}
          onDeleted={(deleted) => {
            setFlash({
              at: null,
              version: null,
              title: "Deleted",
              text: `“${deleted.title}” is deleted. Tablets stop offering it after their next sync.`,
            });
            open(null);
          }}
          onClose={() => open(null)}
        />
      </>
    );
  }

  return (
    <>
      <PageHeader
        title="Checklist templates"
        lead="The checklists crews work through at the sites. Tablets get changes at their next sync."
        actions={
          <Button tone="primary" onClick={() => open(newKey)} disabled={!online}>
            New template
          </Button>
        }
      />
      {offlineNotice}
      {flashNotice}
      {editing !== null && (
        <Notice tone="attention" title="Template not found" className="mb-6">
          It may have been deleted by someone else.
        </Notice>
      )}
      <TemplateList
        templates={list}
        canEdit
        editHref={(id) => `${base}?edit=${encodeURIComponent(id)}`}
      />
    </>
  );
}
