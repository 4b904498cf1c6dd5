// A file read in slices (File.slice + a streaming TextDecoder) and handed on line by line, so a
// file of 10⁷ rows is never held whole. Line numbers are as in the file, the first line being 1.

/** 4 MiB per slice: few round trips, little memory. */
export const sliceBytes = 4 * 1024 * 1024;

export interface LineSplitter {
  /** Text as it comes; a line may be split across pushes. */
  push(text: string): void;
  /** The last line, when the file does not end in a newline. */
  end(): void;
}

export function createLineSplitter(onLine: (text: string, lineNo: number) => void): LineSplitter {
  let carry = "";
  let lineNo = 0;
  const emit = (text: string) => {
    lineNo++;
    onLine(text.endsWith("\r") ? text.slice(0, -1) : text, lineNo);
  };
  return {
    push(text) {
      const joined = carry + text;
      let start = 0;
      for (let nl = joined.indexOf("\n"); nl !== -1; nl = joined.indexOf("\n", start)) {
        emit(joined.slice(start, nl));
        start = nl + 1;
      }
      carry = joined.slice(start);
    },
    end() {
      if (carry !== "") emit(carry);
      carry = "";
    },
  };
}

/** Reads the blob slice by slice; onProgress gets the bytes read so far. */
export async function readLines(
  blob: Blob,
  onLine: (text: string, lineNo: number) => void,
  onProgress: (bytesRead: number) => void = () => undefined,
  bytesPerSlice = sliceBytes,
): Promise<void> {
  const decoder = new TextDecoder("utf-8");
  const splitter = createLineSplitter(onLine);
  for (let offset = 0; offset < blob.size; offset += bytesPerSlice) {
    const bytes = await blob.slice(offset, offset + bytesPerSlice).arrayBuffer();
    // stream: a character cut between two slices is finished by the next one.
    splitter.push(decoder.decode(bytes, { stream: true }));
    onProgress(Math.min(offset + bytesPerSlice, blob.size));
  }
  splitter.push(decoder.decode());
  splitter.end();
}
