import { useState } from "react";
import type { ChecklistTemplateView } from "../../../../shared/schemas/checklists";
import { draftOf, emptyItem, type Draft, type DraftItem, type FieldErrors } from "../lib/draft";

/** The editor's working copy, the version it was opened at, and the messages at its fields. */
export function useTemplateDraft(template: ChecklistTemplateView | null) {
  const [base, setBase] = useState(template);
  const [draft, setDraft] = useState<Draft>(() => draftOf(template));
  const [errors, setErrors] = useState<FieldErrors>({});

  const edit = (next: Partial<Draft>) => setDraft((d) => ({ ...d, ...next }));
  // Positions change: messages about "item 3" would point at the wrong item.
  const restructure = (change: (items: DraftItem[]) => DraftItem[]) => {
    setErrors({});
    setDraft((d) => ({ ...d, items: change(d.items) }));
  };

  return {
    base,
    draft,
    errors,
    setErrors,
    edit,
    changeItem: (key: string, patch: Partial<DraftItem>) =>
      setDraft((d) => ({
        ...d,
        items: d.items.map((i) => (i.key === key ? { ...i, ...patch } : i)),
      })),
    addItem: () => restructure((items) => [...items, emptyItem()]),
    removeItem: (key: string) => restructure((items) => items.filter((i) => i.key !== key)),
    move: (index: number, by: -1 | 1) =>
      restructure((items) => {
        const moved = items[index];
        if (moved === undefined) return items;
        const rest = items.filter((_, i) => i !== index);
        return [...rest.slice(0, index + by), moved, ...rest.slice(index + by)];
      }),
    /** Starts again from this version of the template, as the server has it. */
    reset: (next: ChecklistTemplateView) => {
      setBase(next);
      setDraft(draftOf(next));
      setErrors({});
    },
  };
}

export type TemplateDraftState = ReturnType<typeof useTemplateDraft>;
