// Checking a result against its item, the same on the tablet (flagged at once) and on the server.
import type { ChecklistItem, ChecklistValue } from "./schemas/checklists";

export type ResultCheck = { ok: true; outOfRange: boolean } | { ok: false; message: string };

/** Whether the value fits the item's kind, and for numbers whether it lies outside the range. */
export function checkResult(item: ChecklistItem, value: ChecklistValue): ResultCheck {
  switch (item.kind) {
    case "check":
      return typeof value === "boolean"
        ? { ok: true, outOfRange: false }
        : { ok: false, message: `${item.label}: expected ticked or not` };
    case "number": {
      if (typeof value !== "number" || !Number.isFinite(value))
        return { ok: false, message: `${item.label}: expected a number` };
      const low = item.min !== null && value < item.min;
      const high = item.max !== null && value > item.max;
      return { ok: true, outOfRange: low || high };
    }
    case "text":
      return typeof value === "string"
        ? { ok: true, outOfRange: false }
        : { ok: false, message: `${item.label}: expected text` };
    case "choice":
      return typeof value === "string" && item.options.includes(value)
        ? { ok: true, outOfRange: false }
        : { ok: false, message: `${item.label}: expected one of ${item.options.join(", ")}` };
    case "photo":
      // The value names the attachment link holding the photo.
      return typeof value === "string" && /^[0-9a-f-]{36}$/.test(value)
        ? { ok: true, outOfRange: false }
        : { ok: false, message: `${item.label}: expected a photo` };
  }
}

/** "between 2 and 8 °C", "at most 5 g", or "" when the item has no range. */
export function describeRange(item: Extract<ChecklistItem, { kind: "number" }>): string {
  const unit = item.unit === "" ? "" : ` ${item.unit}`;
  if (item.min !== null && item.max !== null) return `between ${item.min} and ${item.max}${unit}`;
  if (item.min !== null) return `at least ${item.min}${unit}`;
  if (item.max !== null) return `at most ${item.max}${unit}`;
  return "";
}
