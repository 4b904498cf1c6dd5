// Saves data as a file through the browser's download, with no server involved.
export function downloadJson(fileName: string, data: unknown): void {
  downloadBlob(fileName, new Blob([JSON.stringify(data, null, 2)], { type: "application/json" }));
}

export function downloadBlob(fileName: string, blob: Blob): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement("a");
  link.href = url;
  link.download = fileName;
  document.body.append(link);
  link.click();
  link.remove();
  // Give the browser a moment to start the download before the address is released.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

/** "equipot-outbox-2027-06-03T1405Z.json" */
export function exportFileName(kind: string, at = new Date(), extension = "json"): string {
  const stamp = at.toISOString().slice(0, 16).replace(/:/g, "");
  return `equipot-${kind}-${stamp}Z.${extension}`;
}
