// Pure helpers behind the sync screens: values in the crew's words, old pending changes, sizes.
import { describe, expect, it } from "vitest";
import {
  fieldLabel,
  formatFieldValue,
  subjectOf,
} from "../../../src/features/sync/describe-change";
import { changesWord, isOldPending } from "../../../src/features/sync/components/sync-bar";
import { formatBytes } from "../../../src/lib/device-storage";
import { exportFileName } from "../../../src/lib/download";
import type { SyncStatus } from "../../../src/sync/engine";

const status = (oldestPendingAt: string | null): SyncStatus => ({
  running: false,
  pending: oldestPendingAt === null ? 0 : 1,
  pendingFiles: 0,
  oldestPendingAt,
  lastSuccessAt: null,
  progress: null,
  upload: null,
  error: null,
});

describe("formatFieldValue", () => {
  it("shows units, kinds of site and empty values in words", () => {
    expect(formatFieldValue("latitudeDeg", -12.5)).toBe("12.50000° S");
    expect(formatFieldValue("approxHeightM", 2871)).toBe("2871.0 m");
    expect(formatFieldValue("kind", "tunnel")).toBe("Tunnel or underground lab");
    expect(formatFieldValue("notes", "")).toBe("(empty)");
    expect(formatFieldValue("notes", null)).toBe("(nothing)");
    expect(formatFieldValue("other", { a: 1 })).toBe('{"a":1}');
    expect(fieldLabel("approxHeightM")).toBe("Approximate height");
    expect(fieldLabel("unknownField")).toBe("unknownField");
  });
});

describe("subjectOf", () => {
  it("names the site of a refused change", () => {
    const id = crypto.randomUUID();
    const names = new Map([[id, "Col hut"]]);
    expect(subjectOf({ id, name: "Typed name" }, names)).toBe("Typed name");
    expect(subjectOf({ id, changes: { name: "Renamed" } }, names)).toBe("Renamed");
    expect(subjectOf({ id }, names)).toBe("Col hut");
    expect(subjectOf({ id: crypto.randomUUID() }, names)).toBe("A site not on this device");
    expect(subjectOf(null, names)).toBe("Unknown record");
  });
});

describe("isOldPending", () => {
  it("warns only when the oldest pending change is more than a day old", () => {
    const now = Date.parse("2027-06-03T12:00:00.000Z");
    expect(isOldPending(status(null), now)).toBe(false);
    expect(isOldPending(status("2027-06-02T13:00:00.000Z"), now)).toBe(false);
    expect(isOldPending(status("2027-06-02T11:59:00.000Z"), now)).toBe(true);
  });
});

describe("small formats", () => {
  it("counts changes and sizes in words", () => {
    expect(changesWord(1)).toBe("1 change");
    expect(changesWord(3)).toBe("3 changes");
    expect(formatBytes(512)).toBe("512 B");
    expect(formatBytes(12_345_678)).toBe("12.3 MB");
    expect(exportFileName("outbox", new Date("2027-06-03T14:05:09Z"))).toBe(
      "equipot-outbox-2027-06-03T1405Z.json",
    );
  });
});
