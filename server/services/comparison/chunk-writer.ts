// Samples gathered into chunks and written as comparison_chunks rows. The arrays travel as binary
// float8[] parameters (PostgreSQL's array wire format: no number is printed or parsed, so every
// double is stored bit for bit, NaN included). A chunk's insert is on its way while the next chunk
// fills; inserts follow one another in order inside the transaction.
import { sql } from "drizzle-orm";
import type { Tx } from "../../db/client";

/** Samples per stored chunk: big enough that per-row overhead vanishes, small enough to stream. */
export const CHUNK_SAMPLES = 65_536;

const FLOAT8_OID = 701;
const HEADER_BYTES = 20;
const ITEM_BYTES = 12; // a 4-byte length and the 8-byte double

/** A one-dimensional float8[] in the binary wire format, filled sample by sample. */
function binaryArray(capacity: number) {
  const buf = Buffer.allocUnsafe(HEADER_BYTES + ITEM_BYTES * capacity);
  const view = new DataView(buf.buffer, buf.byteOffset, buf.byteLength);
  return { buf, view };
}

function finishArray(array: { buf: Buffer; view: DataView }, length: number): Buffer {
  const { view } = array;
  view.setInt32(0, 1); // dimensions
  view.setInt32(4, 0); // no nulls
  view.setInt32(8, FLOAT8_OID);
  view.setInt32(12, length);
  view.setInt32(16, 1); // lower bound
  return array.buf.subarray(0, HEADER_BYTES + ITEM_BYTES * length);
}

export interface ChunkWriter {
  add(t: number, y: number): void;
  readonly full: boolean;
  /** Sends the current chunk after the ones before it (nothing is awaited here). */
  send(): void;
  /** Waits until at most `inFlight` chunks are still on their way. */
  settle(inFlight: number): Promise<void>;
  /** Waits until nothing sent is still running, failed or not (before a rollback). */
  idle(): Promise<void>;
}

type BinaryArray = ReturnType<typeof binaryArray>;

export function chunkWriter(tx: Tx, fileId: string): ChunkWriter {
  // Arrays whose insert is done, filled again: memory stays a few chunks whatever the file size.
  const free: BinaryArray[] = [];
  const take = () => free.pop() ?? binaryArray(CHUNK_SAMPLES);
  let times = take();
  let values = take();
  let fill = 0;
  let chunkNo = 0;
  const sent: Promise<unknown>[] = [];
  let last: Promise<unknown> = Promise.resolve();

  return {
    add(t, y) {
      const at = HEADER_BYTES + ITEM_BYTES * fill;
      times.view.setInt32(at, 8);
      times.view.setFloat64(at + 4, t);
      values.view.setInt32(at, 8);
      values.view.setFloat64(at + 4, y);
      fill++;
    },
    get full() {
      return fill === CHUNK_SAMPLES;
    },
    send() {
      if (fill === 0) return;
      const t = finishArray(times, fill);
      const y = finishArray(values, fill);
      const no = chunkNo;
      // Each insert starts when the one before it is stored (one query at a time on the
      // connection), and not at all after a failure; parsing goes on meanwhile.
      const filled = [times, values];
      const insert = last
        .then(() =>
          tx.execute(sql`
            insert into comparison_chunks (file_id, chunk_no, times, values)
            values (${fileId}, ${no}, ${t}::float8[], ${y}::float8[])`),
        )
        .then(() => free.push(...filled));
      // Awaited by settle; a failure before then (a refused file) must not go unhandled.
      insert.catch(() => undefined);
      last = insert;
      sent.push(insert);
      chunkNo++;
      fill = 0;
      // The sent arrays belong to the query until it is done: fill others.
      times = take();
      values = take();
    },
    async settle(inFlight) {
      while (sent.length > inFlight) await sent.shift();
    },
    async idle() {
      await Promise.allSettled(sent.splice(0));
    },
  };
}
