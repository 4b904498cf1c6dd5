// An archive file and a name: the archive becomes a new campaign with the importing person as admin.
import { useState, type FormEvent, type ReactNode } from "react";
import { archiveLimits } from "../../../../shared/schemas/campaign-archive";
import { limits } from "../../../../shared/schemas/limits";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useImportArchive } from "../api/import-archive";
import type { TransferProgress } from "../api/transfer";
import { percentOf } from "./download-button";

interface ImportArchiveFormProps {
  /** A link to the new campaign, built by the route. */
  campaignLink: (campaignId: string, name: string) => ReactNode;
  /** After a successful import, e.g. to reload the campaign list. */
  onImported?: () => void;
}

function problemOf(file: File | null, name: string): string | null {
  if (file === null) return "Choose an archive file (.zip)";
  if (file.size > archiveLimits.zipBytes)
    return `The archive is larger than ${Math.round(archiveLimits.zipBytes / 1024 / 1024)} MB`;
  if (name.trim() === "") return "Give the new campaign a name";
  if (name.trim().length > limits.campaignNameMax)
    return `The name may be at most ${limits.campaignNameMax} characters`;
  return null;
}

export function ImportArchiveForm({ campaignLink, onImported }: ImportArchiveFormProps) {
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState("");
  const [tried, setTried] = useState(false);
  const [progress, setProgress] = useState<TransferProgress | null>(null);
  const importing = useImportArchive();
  const problem = problemOf(file, name);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    setTried(true);
    if (problem !== null || file === null) return;
    setProgress(null);
    importing.mutate(
      { file, name: name.trim(), onProgress: setProgress },
      { onSuccess: () => onImported?.() },
    );
  };
  const percent = percentOf(progress);
  return (
    <form className="flex flex-col gap-4" onSubmit={submit} noValidate>
      <div className="flex flex-col gap-1">
        <label htmlFor="archive-file" className="font-semibold">
          Archive file
        </label>
        <input
          id="archive-file"
          type="file"
          accept=".zip,application/zip"
          className="min-h-touch"
          onChange={(e) => {
            setFile(e.target.files?.[0] ?? null);
            importing.reset();
          }}
        />
      </div>
      <TextField
        label="Name of the new campaign"
        value={name}
        maxLength={limits.campaignNameMax}
        onChange={(e) => setName(e.target.value)}
        error={tried && problem !== null ? problem : undefined}
      />
      <div>
        <Button tone="primary" type="submit" disabled={importing.isPending}>
          {importing.isPending
            ? `Importing…${percent === null ? "" : ` ${percent} % sent`}`
            : "Import as a new campaign"}
        </Button>
      </div>
      {importing.isPending && (
        <progress
          className="h-4 w-full"
          max={1}
          aria-label="Archive upload progress"
          {...(percent === null ? {} : { value: percent / 100 })}
        />
      )}
      {importing.isError && (
        <Notice tone="danger" title="Not imported" live>
          {messageOf(importing.error)} Nothing was written.
        </Notice>
      )}
      {importing.data && (
        <Notice title="New campaign created" live>
          <p>
            “{importing.data.campaign.name}” now exists, with you as its administrator. Your
            campaign list has been reloaded; if the new campaign is missing there, sign out and sign
            in again.
          </p>
          <p className="mt-2">
            {campaignLink(importing.data.campaign.id, importing.data.campaign.name)}
          </p>
        </Notice>
      )}
    </form>
  );
}
