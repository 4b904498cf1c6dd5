import type { FieldValues, Path, UseFormSetError } from "react-hook-form";
import { ApiError, messageOf } from "./api-error";

/**
 * Puts a server's 400 details onto the form's fields. Returns the message for the form as a
 * whole (what could not be placed at a field), or null when every issue found its field.
 */
export function applyServerErrors<T extends FieldValues>(
  error: unknown,
  fields: readonly Path<T>[],
  setError: UseFormSetError<T>,
): string | null {
  if (!(error instanceof ApiError) || error.details.length === 0) return messageOf(error);
  const unplaced: string[] = [];
  let firstPlaced = true;
  for (const issue of error.details) {
    // Paths may come as "latitudeDeg", "body.latitudeDeg" or "/latitudeDeg".
    const name = issue.path.split(/[./]/).filter(Boolean).pop() ?? "";
    const field = fields.find((candidate) => candidate === name);
    if (field === undefined) {
      unplaced.push(issue.message);
      continue;
    }
    setError(field, { type: "server", message: issue.message }, { shouldFocus: firstPlaced });
    firstPlaced = false;
  }
  if (unplaced.length === 0) return null;
  return `${error.message} ${unplaced.join(" ")}`.trim();
}
