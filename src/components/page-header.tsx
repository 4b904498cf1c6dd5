import type { ReactNode } from "react";

interface PageHeaderProps {
  title: string;
  /** A line under the title, e.g. the campaign and role. */
  lead?: ReactNode;
  actions?: ReactNode;
}

export function PageHeader({ title, lead, actions }: PageHeaderProps) {
  return (
    <div className="mb-6 flex flex-wrap items-end justify-between gap-4">
      <div className="min-w-0">
        <h1 className="text-3xl font-semibold tracking-tight">{title}</h1>
        {lead !== undefined && <div className="mt-1 text-muted">{lead}</div>}
      </div>
      {actions !== undefined && <div className="flex flex-wrap gap-3">{actions}</div>}
    </div>
  );
}
