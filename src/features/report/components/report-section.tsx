// One numbered part of the report; in print each part starts on a new page.
import type { ReactNode } from "react";

interface ReportSectionProps {
  id: string;
  title: string;
  /** A line under the heading: where the numbers come from. */
  lead?: ReactNode;
  children: ReactNode;
}

export function ReportSection({ id, title, lead, children }: ReportSectionProps) {
  return (
    <section aria-labelledby={id} data-report-section="" className="flex flex-col gap-4">
      <div>
        <h2 id={id} className="text-2xl font-semibold">
          {title}
        </h2>
        {lead !== undefined && <p className="mt-1 text-muted">{lead}</p>}
      </div>
      {children}
    </section>
  );
}

/** Kept on one page when printed (a table, a chart, a result). */
export function ReportBlock({ children, title }: { children: ReactNode; title?: string }) {
  return (
    <div data-report-keep="" className="flex flex-col gap-2">
      {title !== undefined && <h3 className="text-lg font-semibold">{title}</h3>}
      {children}
    </div>
  );
}
