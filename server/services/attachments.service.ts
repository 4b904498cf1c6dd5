// Attachment rules: content-addressed, idempotent, de-duplicated per campaign. The object is
// stored before its row, so a row always has its object; an object without a row is harmless
// and reused by the next attempt.
import { createReadStream } from "node:fs";
import type { Readable } from "node:stream";
import {
  attachmentLimits,
  type AttachmentContentType,
  type AttachmentView,
} from "../../shared/schemas/attachments";
import type { Db } from "../db/client";
import { recordAudit } from "../db/repositories/audit";
import { findAttachment, insertAttachment } from "../db/repositories/attachments";
import { badRequest, HttpError, notFound, unavailable } from "../http-errors";
import { presentAttachment } from "../presenters/attachment";
import { attachmentKey, StorageError, toStorageError, type Storage } from "../storage/storage";
import { sniffContentType } from "./attachments-content";
import { receiveBody, type ReceivedBody } from "./attachments-receive";

export interface AttachmentDeps {
  db: Db;
  storage: Storage;
  maxBytes?: number;
}

interface Scope {
  campaignId: string;
  userId: string;
}

export interface UploadInput {
  sha256: string;
  declaredType?: AttachmentContentType;
  declaredBytes?: number;
  name: string | null;
}

export interface UploadResult {
  created: boolean;
  attachment: AttachmentView;
}

const megabytes = (bytes: number) => `${Math.round(bytes / (1024 * 1024))} MB`;
const tooLarge = (maxBytes: number) =>
  new HttpError(413, "payload_too_large", `The file is larger than ${megabytes(maxBytes)}`);
const damaged = () =>
  badRequest("The file arrived damaged (checksum differs); it will be sent again");

/** Storage failures as the one error body: 507 when full, 503 otherwise; others pass through. */
export function storageHttpError(err: unknown): unknown {
  const known = err instanceof StorageError ? err : toStorageError(err);
  if (!(known instanceof StorageError)) return err;
  if (known.kind === "full")
    return new HttpError(
      507,
      "storage_full",
      "The server's file storage is full; the file stays on this device, try again later",
    );
  return unavailable("The file storage is not available right now; try again later");
}

async function receive(body: Readable, maxBytes: number): Promise<ReceivedBody> {
  try {
    return await receiveBody(body, maxBytes);
  } catch (err) {
    const mapped = storageHttpError(err);
    if (mapped instanceof HttpError) throw mapped;
    throw badRequest("The upload was interrupted; it will be sent again");
  }
}

async function storeObject(storage: Storage, key: string, received: ReceivedBody, type: string) {
  try {
    // Same key means same bytes (the key holds the verified hash), so a leftover is reused.
    if (await storage.exists(key)) return;
    const options = { contentType: type, sizeBytes: received.sizeBytes };
    await storage.put(key, createReadStream(received.path), options);
  } catch (err) {
    throw storageHttpError(err);
  }
}

async function recordRow(db: Db, scope: Scope, row: Parameters<typeof insertAttachment>[1]) {
  return db.transaction(async (tx) => {
    const inserted = await insertAttachment(tx, row);
    if (!inserted) return undefined;
    const view = presentAttachment(inserted);
    await recordAudit(tx, {
      ...scope,
      action: "create",
      entity: "attachment",
      entityId: inserted.sha256,
      after: view,
    });
    return view;
  });
}

export async function uploadAttachment(
  deps: AttachmentDeps,
  scope: Scope,
  input: UploadInput,
  body: Readable,
): Promise<UploadResult> {
  const maxBytes = deps.maxBytes ?? attachmentLimits.maxBytes;
  const existing = await findAttachment(deps.db, scope.campaignId, input.sha256);
  // Already verified and stored: the retry's body is not needed (Node drains it).
  if (existing) return { created: false, attachment: presentAttachment(existing) };
  if (input.declaredBytes !== undefined && input.declaredBytes > maxBytes) throw tooLarge(maxBytes);

  const received = await receive(body, maxBytes);
  try {
    if (received.tooLarge) throw tooLarge(maxBytes);
    if (received.sha256 !== input.sha256) throw damaged();
    if (received.sizeBytes === 0) throw badRequest("The file is empty; nothing was stored");
    const contentType = await sniffContentType(received, {
      type: input.declaredType,
      name: input.name,
    });
    const key = attachmentKey(scope.campaignId, input.sha256);
    await storeObject(deps.storage, key, received, contentType);
    const row = {
      campaignId: scope.campaignId,
      sha256: input.sha256,
      contentType,
      sizeBytes: received.sizeBytes,
      storageKey: key,
      originalName: input.name,
      createdBy: scope.userId,
    };
    const created = await recordRow(deps.db, scope, row);
    if (created) return { created: true, attachment: created };
    // A parallel upload of the same file won the insert.
    return findExisting(deps.db, scope.campaignId, input.sha256);
  } finally {
    await received.cleanup();
  }
}

async function findExisting(db: Db, campaignId: string, sha256: string): Promise<UploadResult> {
  const row = await findAttachment(db, campaignId, sha256);
  if (!row) throw unavailable("The file was stored but its record could not be read; try again");
  return { created: false, attachment: presentAttachment(row) };
}

export async function attachmentMeta(
  db: Db,
  campaignId: string,
  sha256: string,
): Promise<AttachmentView> {
  const row = await findAttachment(db, campaignId, sha256);
  if (!row) throw notFound("Attachment not found");
  return presentAttachment(row);
}

export async function openAttachment(deps: AttachmentDeps, campaignId: string, sha256: string) {
  const row = await findAttachment(deps.db, campaignId, sha256);
  if (!row) throw notFound("Attachment not found");
  const object = await deps.storage.get(row.storageKey).catch((err: unknown) => {
    throw storageHttpError(err);
  });
  if (!object) throw unavailable("The file's content is missing from storage");
  return { attachment: presentAttachment(row), object };
}
