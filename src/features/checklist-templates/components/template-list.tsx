import type { ChecklistTemplateView } from "../../../../shared/schemas/checklists";
import { LinkButton } from "../../../components/button";
import { formatUtc } from "../../../lib/format";
import { purposeLabels } from "../lib/draft";

interface TemplateListProps {
  templates: ChecklistTemplateView[];
  editHref: (templateId: string) => string;
  canEdit: boolean;
}

export function TemplateList({ templates, editHref, canEdit }: TemplateListProps) {
  if (templates.length === 0)
    return <p className="text-muted">This campaign has no checklist templates yet.</p>;
  return (
    <div className="relative overflow-x-auto rounded-xl border-2 border-line bg-surface">
      <table className="w-full border-collapse">
        <caption className="sr-only">Checklist templates of this campaign</caption>
        <thead className="bg-sunken text-left text-sm">
          <tr>
            <th scope="col" className="px-4 py-2">
              Title
            </th>
            <th scope="col" className="px-4 py-2">
              Purpose
            </th>
            <th scope="col" className="px-4 py-2 text-right">
              Items
            </th>
            <th scope="col" className="px-4 py-2 text-right">
              Version
            </th>
            <th scope="col" className="px-4 py-2">
              Last changed
            </th>
            {canEdit && (
              <th scope="col" className="px-4 py-2">
                <span className="sr-only">Actions</span>
              </th>
            )}
          </tr>
        </thead>
        <tbody>
          {templates.map((template) => (
            <tr key={template.id} className="border-t border-line">
              <th scope="row" className="px-4 py-3 text-left font-semibold">
                {template.title}
              </th>
              <td className="px-4 py-3">{purposeLabels[template.purpose]}</td>
              <td className="px-4 py-3 text-right tabular-nums">{template.items.length}</td>
              <td className="px-4 py-3 text-right tabular-nums">{template.version}</td>
              <td className="px-4 py-3 tabular-nums">{formatUtc(template.updatedAt)}</td>
              {canEdit && (
                <td className="px-4 py-2 text-right">
                  <LinkButton to={editHref(template.id)} aria-label={`Edit ${template.title}`}>
                    Edit
                  </LinkButton>
                </td>
              )}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
