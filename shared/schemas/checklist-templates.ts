// Requests that administrators send to edit checklist templates in the office (REST, online).
// The items are the same as the tablets pull; every text is also checked for NUL here, because
// PostgreSQL's jsonb cannot store it and the write would otherwise fail as a server error.
import { z } from "zod";
import { checklistItems, checklistPurpose, type checklistItem } from "./checklists";
import { hasNul, nulMessage } from "./text";

export const checklistTemplateLimits = { titleMax: 200 } as const;

const title = z
  .string()
  .trim()
  .min(1, "Title is required")
  .max(
    checklistTemplateLimits.titleMax,
    `Title must be at most ${checklistTemplateLimits.titleMax} characters`,
  )
  .refine((v) => !hasNul(v), nulMessage("Title"));

type ItemOutput = z.output<typeof checklistItem>;

interface ItemText {
  path: (string | number)[];
  name: string;
  value: string;
}

/** Every text of an item with its path and its name for the message. */
function textsOf(item: ItemOutput): ItemText[] {
  const texts: ItemText[] = [
    { path: ["label"], name: "Label", value: item.label },
    { path: ["help"], name: "Help", value: item.help },
  ];
  if (item.caution)
    texts.push({ path: ["caution", "text"], name: "Caution", value: item.caution.text });
  if (item.kind === "number") texts.push({ path: ["unit"], name: "Unit", value: item.unit });
  if (item.kind === "choice")
    item.options.forEach((value, i) => texts.push({ path: ["options", i], name: "Option", value }));
  return texts;
}

export const templateItems = checklistItems.superRefine((items, ctx) => {
  items.forEach((item, index) => {
    for (const text of textsOf(item)) {
      if (hasNul(text.value))
        ctx.addIssue({
          code: "custom",
          path: [index, ...text.path],
          message: nulMessage(text.name),
        });
    }
  });
});

export const checklistTemplateCreateInput = z.strictObject({
  // Made by the client, like every other record's id.
  id: z.uuid("id must be a UUID"),
  title,
  purpose: checklistPurpose,
  items: templateItems,
});
export type ChecklistTemplateCreateInput = z.input<typeof checklistTemplateCreateInput>;

/** A whole replacement of the template, made against the version the editor opened. */
export const checklistTemplateUpdateInput = z.strictObject({
  baseVersion: z.number().int().positive("baseVersion must be a positive whole number"),
  title,
  purpose: checklistPurpose,
  items: templateItems,
});
export type ChecklistTemplateUpdateInput = z.input<typeof checklistTemplateUpdateInput>;

/** The editor's fields, checked on the tablet before sending. */
export const checklistTemplateFields = checklistTemplateUpdateInput.omit({ baseVersion: true });
