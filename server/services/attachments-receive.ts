// Spools an upload to a private temporary file while hashing it, counting it, keeping its first
// bytes for sniffing and checking whether it is valid UTF-8 text. Past the size limit the rest is
// read and dropped (never stored), so the client still gets a clean 413 instead of a reset.
import { createHash } from "node:crypto";
import { createWriteStream } from "node:fs";
import { mkdtemp, rm } from "node:fs/promises";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { Transform, type Readable } from "node:stream";
import { pipeline } from "node:stream/promises";

const headBytes = 64 * 1024;

export interface ReceivedBody {
  path: string;
  sha256: string;
  sizeBytes: number;
  tooLarge: boolean;
  head: Buffer;
  /** Valid UTF-8 without NUL bytes: the only shape a CSV may have. */
  utf8Text: boolean;
  cleanup: () => Promise<void>;
}

interface Inspection {
  sha256: string;
  sizeBytes: number;
  tooLarge: boolean;
  head: Buffer;
  utf8Text: boolean;
}

function inspector(maxBytes: number, result: Inspection): Transform {
  const hash = createHash("sha256");
  const decoder = new TextDecoder("utf-8", { fatal: true });
  const headChunks: Buffer[] = [];
  let headLength = 0;
  const checkText = (chunk?: Buffer) => {
    if (!result.utf8Text) return;
    try {
      decoder.decode(chunk, { stream: chunk !== undefined });
      if (chunk?.includes(0)) result.utf8Text = false;
    } catch {
      result.utf8Text = false;
    }
  };
  return new Transform({
    transform(chunk: Buffer, _encoding, done) {
      result.sizeBytes += chunk.length;
      if (result.sizeBytes > maxBytes) result.tooLarge = true;
      if (result.tooLarge) return done();
      hash.update(chunk);
      checkText(chunk);
      if (headLength < headBytes) {
        headChunks.push(chunk);
        headLength += chunk.length;
      }
      done(null, chunk);
    },
    flush(done) {
      checkText();
      result.sha256 = hash.digest("hex");
      result.head = Buffer.concat(headChunks).subarray(0, headBytes);
      done();
    },
  });
}

export async function receiveBody(source: Readable, maxBytes: number): Promise<ReceivedBody> {
  const dir = await mkdtemp(join(tmpdir(), "equipot-upload-"));
  const cleanup = () => rm(dir, { recursive: true, force: true });
  const path = join(dir, "body");
  const result: Inspection = {
    sha256: "",
    sizeBytes: 0,
    tooLarge: false,
    head: Buffer.alloc(0),
    utf8Text: true,
  };
  const inspect = inspector(maxBytes, result);
  // The request is piped rather than put in the pipeline: a failed write must not destroy the
  // socket, so the rest of the body is drained and the client still reads the error answer.
  const onSourceError = (err: Error) => inspect.destroy(err);
  source.on("error", onSourceError);
  source.pipe(inspect);
  try {
    await pipeline(inspect, createWriteStream(path, { flags: "wx" }));
  } catch (err) {
    source.unpipe(inspect);
    source.resume();
    await cleanup();
    throw err;
  } finally {
    source.off("error", onSourceError);
  }
  return { ...result, path, cleanup };
}
