import type { z } from "zod";
import type { FieldIssue } from "../../shared/schemas/errors";
import { validationFailed } from "../http-errors";

export function toFieldIssues(error: z.ZodError): FieldIssue[] {
  return error.issues.map((issue) => {
    // An empty key is still a field the caller sent: shown as "" so the answer can name it.
    const keys = (issue.code === "unrecognized_keys" ? issue.keys : []).map((k) =>
      k === "" ? '""' : k,
    );
    const base = issue.path.map(String).join(".");
    const path = keys.length > 0 ? [base, keys.join(",")].filter(Boolean).join(".") : base;
    const message =
      keys.length > 0
        ? `Unknown field${keys.length > 1 ? "s" : ""}: ${keys.join(", ")}`
        : issue.message;
    return { path, message };
  });
}

/** Parses untrusted input with a shared zod schema; a failure is a 400 that names each bad field. */
export function parseInput<S extends z.ZodType>(schema: S, input: unknown): z.output<S> {
  const result = schema.safeParse(input);
  if (!result.success) throw validationFailed(toFieldIssues(result.error));
  return result.data;
}
