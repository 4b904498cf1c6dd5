// A picked file to text, slice by slice so a large file reports bytes read of the total. Bytes that
// are not UTF-8 become U+FFFD, which the parser reports with their line.
export const maxFileBytes = 20 * 1024 * 1024;
const sliceBytes = 1024 * 1024;

export interface ReadProgress {
  doneBytes: number;
  totalBytes: number;
}

export class FileTooLargeError extends Error {
  constructor(sizeBytes: number) {
    super(
      `The file is ${(sizeBytes / 1024 / 1024).toFixed(1)} MB; at most ${maxFileBytes / 1024 / 1024} MB can be imported at once`,
    );
    this.name = "FileTooLargeError";
  }
}

export async function readFileText(
  file: Blob,
  onProgress?: (progress: ReadProgress) => void,
): Promise<string> {
  if (file.size > maxFileBytes) throw new FileTooLargeError(file.size);
  const decoder = new TextDecoder("utf-8");
  const parts: string[] = [];
  for (let at = 0; at < file.size; at += sliceBytes) {
    const bytes = await file.slice(at, at + sliceBytes).arrayBuffer();
    parts.push(decoder.decode(bytes, { stream: true }));
    onProgress?.({ doneBytes: Math.min(at + sliceBytes, file.size), totalBytes: file.size });
  }
  parts.push(decoder.decode());
  return parts.join("");
}
