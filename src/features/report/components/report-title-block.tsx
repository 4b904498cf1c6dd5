// The first page's head: what this is, for which campaign, when and by whom it was printed, and
// the caution that these heights are the campaign's own.
import { Button } from "../../../components/button";
import { StatusShape } from "../../../components/status-shape";
import { formatLocalBeside, formatUtc } from "../../../lib/format";

interface ReportTitleBlockProps {
  campaignName: string;
  description?: string;
  printedAtIso: string;
  printedBy: string;
  caution: string;
}

export function ReportTitleBlock(props: ReportTitleBlockProps) {
  const { campaignName, description, printedAtIso, printedBy, caution } = props;
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-start justify-between gap-4">
        <div className="min-w-0">
          <p className="text-sm font-semibold tracking-wide text-muted uppercase">
            Campaign report
          </p>
          <h1 className="text-3xl font-semibold tracking-tight">{campaignName}</h1>
          {description !== undefined && description !== "" && <p className="mt-1">{description}</p>}
        </div>
        <Button tone="primary" onClick={() => window.print()}>
          Print or save as PDF
        </Button>
      </div>
      <dl className="grid gap-x-6 gap-y-1 tabular-nums sm:grid-cols-[auto_1fr]">
        <dt className="text-muted">Printed</dt>
        <dd data-testid="report-printed-at">
          {formatUtc(printedAtIso)}{" "}
          <span className="text-muted">({formatLocalBeside(printedAtIso)})</span>
        </dd>
        <dt className="text-muted">Printed by</dt>
        <dd>{printedBy}</dd>
      </dl>
      <div
        data-testid="report-caution"
        className="flex gap-3 rounded-lg border-4 border-ink px-4 py-3 text-lg font-semibold"
      >
        <StatusShape shape="triangle" className="mt-1" />
        <p>{caution}</p>
      </div>
    </div>
  );
}

/** The last lines of the report: the caution again, where a reader of the end looks. */
export function ReportFooter({ caution, generator }: { caution: string; generator: string }) {
  return (
    <footer
      data-testid="report-footer"
      data-report-keep=""
      className="flex flex-col gap-1 border-t-2 border-ink pt-3 text-sm"
    >
      <p className="font-semibold">{caution}</p>
      <p className="text-muted">{generator}</p>
    </footer>
  );
}
