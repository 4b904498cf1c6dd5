// A site's checklists: the runs under way and done, and one button per template to start one.
import { useState } from "react";
import { useNavigate } from "react-router-dom";
import { Button, LinkButton } from "../../../components/button";
import { Notice } from "../../../components/notice";
import { PendingMark } from "../../../components/pending-mark";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { formatLocalBeside, formatUtc } from "../../../lib/format";
import { useChecklistWrites, useSiteChecklists } from "../hooks/use-checklists";

interface SiteChecklistsProps {
  campaignId: string;
  siteId: string;
  canRecord: boolean;
  runHref: (runId: string) => string;
}

export function SiteChecklists({ campaignId, siteId, canRecord, runHref }: SiteChecklistsProps) {
  const { templates, runs } = useSiteChecklists(campaignId, siteId);
  const writes = useChecklistWrites(campaignId);
  const navigate = useNavigate();
  const [error, setError] = useState<unknown>(null);

  const start = async (templateId: string) => {
    setError(null);
    try {
      navigate(runHref(await writes.start(templateId, siteId)));
    } catch (caught) {
      setError(caught);
    }
  };

  return (
    <section aria-labelledby="site-checklists" className="flex flex-col gap-3">
      <h2 id="site-checklists" className="text-xl font-semibold">
        Checklists
      </h2>
      {runs !== undefined && runs.length > 0 && (
        <ul aria-label="Checklists at this site" className="flex flex-col gap-2">
          {runs.map((run) => (
            <li
              key={run.id}
              className="flex flex-wrap items-center gap-3 rounded-lg border-2 border-line bg-surface p-3"
            >
              <StatusShape
                shape={run.signedOffAt === null ? "dots" : "disc"}
                className="text-primary"
              />
              <span className="font-semibold">{run.title}</span>
              <span className="text-sm text-muted tabular-nums">
                {run.signedOffAt === null
                  ? `Started ${formatUtc(run.startedAt)} (${formatLocalBeside(run.startedAt)})`
                  : `Signed off ${formatUtc(run.signedOffAt)}`}
              </span>
              {run.pending && <PendingMark />}
              <LinkButton className="ml-auto" to={runHref(run.id)}>
                {run.signedOffAt === null ? "Continue" : "Open"}
              </LinkButton>
            </li>
          ))}
        </ul>
      )}
      {runs !== undefined && runs.length === 0 && (
        <p className="text-muted">No checklist has been started at this site yet.</p>
      )}
      {canRecord && templates !== undefined && templates.length > 0 && (
        <div className="flex flex-col gap-2">
          <p className="font-semibold">Start a checklist</p>
          <div className="flex flex-wrap gap-3">
            {templates.map((template) => (
              <Button key={template.id} onClick={() => void start(template.id)}>
                {template.title}
              </Button>
            ))}
          </div>
        </div>
      )}
      {error !== null && (
        <Notice tone="danger" title="Not started" live>
          {messageOf(error)}
        </Notice>
      )}
    </section>
  );
}
