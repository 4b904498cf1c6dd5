import { describe, expect, test, vi } from "vitest";
import { ApiError } from "../../../src/lib/api-error";
import { applyServerErrors } from "../../../src/lib/form-errors";

type Values = { name: string; latitudeDeg: number };
const fields = ["name", "latitudeDeg"] as const;

describe("applyServerErrors", () => {
  test("puts each detail on the field it names, whatever the path prefix", () => {
    const setError = vi.fn();
    const error = new ApiError(400, "validation_failed", "Refused", [
      { path: "latitudeDeg", message: "Latitude out of range" },
      { path: "body.name", message: "Name taken" },
    ]);
    expect(applyServerErrors<Values>(error, fields, setError)).toBeNull();
    expect(setError).toHaveBeenCalledWith(
      "latitudeDeg",
      { type: "server", message: "Latitude out of range" },
      { shouldFocus: true },
    );
    expect(setError).toHaveBeenCalledWith(
      "name",
      { type: "server", message: "Name taken" },
      { shouldFocus: false },
    );
  });

  test("returns what found no field as a message for the whole form", () => {
    const setError = vi.fn();
    const error = new ApiError(400, "validation_failed", "Refused.", [
      { path: "id", message: "Site id must be a UUID" },
    ]);
    expect(applyServerErrors<Values>(error, fields, setError)).toBe(
      "Refused. Site id must be a UUID",
    );
    expect(setError).not.toHaveBeenCalled();
  });

  test("other errors keep their own message", () => {
    const setError = vi.fn();
    expect(applyServerErrors<Values>(ApiError.network(null), fields, setError)).toBe(
      "No connection to the Equipot server.",
    );
    expect(applyServerErrors<Values>(new Error("boom"), fields, setError)).toBe("boom");
  });
});
