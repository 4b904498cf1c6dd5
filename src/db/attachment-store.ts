// Local writes of photos and files: the bytes, their link to a record and the outbox entry in one
// transaction. The hash is taken before the transaction (WebCrypto would let it commit early).
import {
  attachmentContentType,
  attachmentLimits,
  attachmentLinkInput,
  type AttachmentContentType,
  type AttachmentSubjectKind,
} from "../../shared/schemas/attachments";
import { fileKey, type EquipotDb, type LocalFile } from "./database";
import { recordMutation } from "./outbox";

export async function sha256Of(bytes: ArrayBuffer): Promise<string> {
  const digest = new Uint8Array(await crypto.subtle.digest("SHA-256", bytes));
  return Array.from(digest, (b) => b.toString(16).padStart(2, "0")).join("");
}

export interface NewAttachment {
  subject: { kind: AttachmentSubjectKind; id: string };
  bytes: ArrayBuffer;
  contentType: AttachmentContentType;
  name: string;
  caption?: string;
  takenAt?: string | null;
}

/** Keeps the file on this device and queues its link; the bytes are uploaded by the engine. */
export async function addAttachmentLocally(
  db: EquipotDb,
  campaignId: string,
  input: NewAttachment,
  id = crypto.randomUUID(),
): Promise<string> {
  const contentType = attachmentContentType.parse(input.contentType);
  if (input.bytes.byteLength > attachmentLimits.maxBytes)
    throw new Error(
      `The file is larger than ${Math.round(attachmentLimits.maxBytes / 2 ** 20)} MB and cannot be kept`,
    );
  const sha256 = await sha256Of(input.bytes);
  const args = attachmentLinkInput.parse({
    id,
    sha256,
    contentType,
    sizeBytes: input.bytes.byteLength,
    name: input.name.slice(0, attachmentLimits.nameMax),
    subject: input.subject,
    caption: input.caption ?? "",
    takenAt: input.takenAt ?? null,
  });
  const key = fileKey(campaignId, sha256);
  const file: LocalFile = {
    key,
    campaignId,
    sha256,
    contentType,
    sizeBytes: input.bytes.byteLength,
    name: args.name,
    bytes: input.bytes,
    state: "waiting",
    refusal: null,
    addedAt: new Date().toISOString(),
    sentAt: null,
  };
  await recordMutation(
    db,
    { campaignId, name: "attachment.add", entityId: id, args },
    {
      tables: [db.files],
      // The same bytes attached twice are kept once; a file already sent stays sent.
      write: async () => {
        if (!(await db.files.get(key))) await db.files.add(file);
      },
    },
  );
  return id;
}

export async function removeAttachmentLocally(db: EquipotDb, campaignId: string, id: string) {
  const current = await db.attachments.get(id);
  if (!current || current.campaignId !== campaignId)
    throw new Error("This attachment is not on this device");
  await recordMutation(db, { campaignId, name: "attachment.remove", entityId: id, args: { id } });
}

/** A file fetched from the server, kept as a cache for offline viewing. */
export async function keepDownloadedFile(
  db: EquipotDb,
  file: Omit<LocalFile, "key" | "state" | "refusal" | "addedAt" | "sentAt">,
): Promise<void> {
  const key = fileKey(file.campaignId, file.sha256);
  const now = new Date().toISOString();
  await db.transaction("rw", db.files, async () => {
    if (await db.files.get(key)) return;
    await db.files.add({ ...file, key, state: "sent", refusal: null, addedAt: now, sentAt: now });
  });
}
