// Lines of a byte stream, cut where readline cuts them (LF, CRLF or a lone CR), without turning
// every line into a string: each line is handed on as a range of the chunk it lies in. A line
// split across chunks is copied once into a carry buffer. A UTF-8 byte-order mark at the start
// of the stream is dropped.

const LF = 0x0a;
const CR = 0x0d;

/** Receives one line (without its line break), numbered from 1. */
export type LineSink = (buf: Buffer, start: number, end: number, lineNo: number) => void;

export interface LineSplitter {
  push(chunk: Buffer): void;
  /** Hands on the last line when the stream does not end with a line break. */
  end(): void;
  readonly lines: number;
  /** Stops handing on lines (the caller has seen enough). */
  stop(): void;
}

export function createLineSplitter(sink: LineSink): LineSplitter {
  let carry: Buffer | null = null;
  let lineNo = 0;
  let atStart = true;
  // A CR ended the previous chunk: an LF that starts the next one belongs to it.
  let skipLf = false;
  let stopped = false;
  // readline hands on a file that is only a byte-order mark as one empty line.
  let onlyBom = false;

  function emit(buf: Buffer, start: number, end: number) {
    lineNo++;
    sink(buf, start, end, lineNo);
  }

  function push(input: Buffer) {
    if (stopped || input.length === 0) return;
    let chunk = input;
    if (atStart) {
      const joined: Buffer = carry === null ? chunk : Buffer.concat([carry, chunk]);
      if (joined.length < 3 && joined.every((b, i) => b === [0xef, 0xbb, 0xbf][i])) {
        carry = joined; // too short to tell whether it is a byte-order mark
        return;
      }
      atStart = false;
      carry = null;
      const bom = joined[0] === 0xef && joined[1] === 0xbb && joined[2] === 0xbf;
      chunk = bom ? joined.subarray(3) : joined;
      onlyBom = bom;
    }
    if (chunk.length === 0) return;
    onlyBom = false;
    let from = 0;
    if (skipLf && chunk[0] === LF) from = 1;
    skipLf = false;
    const n = chunk.length;
    let i = from;
    let lineStart = from;
    while (i < n) {
      const b = chunk[i];
      if (b !== LF && b !== CR) {
        i++;
        continue;
      }
      if (carry !== null) {
        const whole = Buffer.concat([carry, chunk.subarray(lineStart, i)]);
        carry = null;
        emit(whole, 0, whole.length);
      } else emit(chunk, lineStart, i);
      if (stopped) return;
      if (b === CR) {
        if (i + 1 < n) {
          if (chunk[i + 1] === LF) i++;
        } else skipLf = true;
      }
      i++;
      lineStart = i;
    }
    if (lineStart < n) {
      const rest = chunk.subarray(lineStart);
      carry = carry === null ? Buffer.from(rest) : Buffer.concat([carry, rest]);
    }
  }

  return {
    push,
    end() {
      if (stopped) return;
      if (carry !== null && carry.length > 0) {
        const last = carry;
        carry = null;
        emit(last, 0, last.length);
      } else if (onlyBom) emit(Buffer.alloc(0), 0, 0);
    },
    get lines() {
      return lineNo;
    },
    stop() {
      stopped = true;
    },
  };
}
