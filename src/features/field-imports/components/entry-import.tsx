// Importing a logger's CSV on the tablet, offline: the crate, the file, the logger model and its
// mapping, a preview, every problem by line, then one local transaction for all parts.
import { useId, useState } from "react";
import type { EntryFlags } from "../../../../shared/schemas/field-entries";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Loading } from "../../../components/loading";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { useCrates, useImportWrites } from "../hooks/use-field-imports";
import { useImportFile } from "../hooks/use-import-file";
import { rememberMapping, rememberedModels } from "../mapping-memory";
import type { ImportKind } from "../parse/mapping";
import type { ParsedFile } from "../parse/parse-csv";
import { splitIntoDrafts } from "../parse/split";
import {
  ImportErrors,
  ImportPreview,
  ImportProgressBar,
  type ImportProgress,
} from "./import-parts";
import { MappingForm } from "./mapping-form";

const count = new Intl.NumberFormat("en-GB");

export interface EntryImportProps {
  campaignId: string;
  siteId: string;
  kind: ImportKind;
  /** can(role, "entry.record"); without it the screen says so and offers nothing. */
  canRecord: boolean;
  /** Where to go after a successful import (e.g. the temperatures screen), and its button's words. */
  onDone?: () => void;
  doneLabel?: string;
}

interface Saved {
  parts: number;
  readings: number;
  flags: EntryFlags[];
}

const readingsOf = (p: ParsedFile) =>
  p.kind === "temperatures" ? p.samples.length : p.events.length;

function SavedNotice({ saved, kind }: { saved: Saved; kind: ImportKind }) {
  const exceeded = saved.flags.some((f) => f.exceeded);
  const verdict = exceeded
    ? kind === "temperatures"
      ? "outside the crate's band"
      : "peaks above the crate's limit"
    : kind === "temperatures"
      ? "within the crate's band"
      : "within the crate's limit";
  const parts = saved.parts === 1 ? "1 part" : `${saved.parts} parts`;
  return (
    <Notice tone={exceeded ? "attention" : "info"} title="Saved on this device" live>
      <p className="tabular-nums">
        {parts}, {count.format(saved.readings)} readings; {verdict}
      </p>
      <ul className="mt-2 flex flex-col gap-1">
        {saved.flags.map((f, i) => (
          <li key={i} className="flex items-start gap-2 tabular-nums">
            <StatusShape
              shape={f.exceeded ? "octagon" : "disc"}
              className={f.exceeded ? "mt-0.5 text-danger" : "mt-0.5 text-primary"}
            />
            <span>
              Part {i + 1}: {f.summary}
            </span>
          </li>
        ))}
      </ul>
    </Notice>
  );
}

export function EntryImport({
  campaignId,
  siteId,
  kind,
  canRecord,
  onDone,
  doneLabel = "Done",
}: EntryImportProps) {
  const crates = useCrates(campaignId);
  const writes = useImportWrites(campaignId);
  const { state, pick, changeMapping, applyModel } = useImportFile(kind);
  const [crateId, setCrateId] = useState("");
  const [loggerModel, setLoggerModel] = useState("");
  const [saving, setSaving] = useState<ImportProgress | null>(null);
  const [saved, setSaved] = useState<Saved | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);
  const modelsId = useId();
  // A new key empties the file input after a save.
  const [fileInput, setFileInput] = useState(0);

  if (!canRecord)
    return (
      <Notice title="Not available for your role">
        Importing readings is for the crew and logistics.
      </Notice>
    );
  if (crates === undefined) return <Loading label="Reading the crates on this device…" />;

  const { parsed, mapping, file } = state;
  const good = parsed !== null && parsed.errorCount === 0 ? parsed : null;
  const readings = good === null ? 0 : readingsOf(good);
  const progress = saving ?? state.progress;
  const busy = progress !== null;
  const crateMissing = crateId === "";

  const save = async () => {
    if (good === null || file === null || mapping === null || crateMissing) return;
    setSaveError(null);
    setSaving({ label: "Saving on this device…", fraction: null });
    try {
      const drafts = splitIntoDrafts(good, { siteId, crateId, loggerModel, fileName: file.name });
      const results = await writes.save(drafts);
      rememberMapping(loggerModel, mapping);
      setSaved({ parts: drafts.length, readings, flags: results.map((r) => r.flags) });
      void pick(null, loggerModel);
      setFileInput((n) => n + 1);
    } catch (error) {
      setSaveError(messageOf(error));
    } finally {
      setSaving(null);
    }
  };

  return (
    <div className="flex max-w-5xl flex-col gap-6">
      {saved !== null && (
        <div className="flex flex-col gap-3">
          <SavedNotice saved={saved} kind={kind} />
          {onDone !== undefined && (
            <div>
              <Button onClick={onDone}>{doneLabel}</Button>
            </div>
          )}
        </div>
      )}
      {crates.length === 0 && (
        <Notice tone="attention" title="No crates on this device">
          Readings are imported for a crate. Sync once so this device knows the campaign's crates.
        </Notice>
      )}
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField
          label="Crate"
          value={crateId}
          disabled={busy}
          error={saveError === null || !crateMissing ? undefined : "Choose the crate"}
          onChange={(e) => setCrateId(e.target.value)}
        >
          <option value="">— choose the crate —</option>
          {crates.map((c) => (
            <option key={c.id} value={c.id}>
              {kind === "temperatures"
                ? `${c.label} (${c.temperatureMinC} … ${c.temperatureMaxC} °C)`
                : `${c.label} (up to ${c.maxShockG} g)`}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Logger model"
          hint="The mapping is remembered for this model on this device."
          list={modelsId}
          value={loggerModel}
          maxLength={120}
          disabled={busy}
          onChange={(e) => setLoggerModel(e.target.value)}
          onBlur={() => applyModel(loggerModel)}
        />
        <datalist id={modelsId}>
          {rememberedModels(kind).map((m) => (
            <option key={m} value={m} />
          ))}
        </datalist>
        <TextField
          key={fileInput}
          label={
            kind === "temperatures" ? "Temperature logger file (CSV)" : "Shock logger file (CSV)"
          }
          type="file"
          accept=".csv,text/csv"
          disabled={busy}
          className="py-3"
          onChange={(e) => {
            setSaved(null);
            void pick(e.target.files?.[0] ?? null, loggerModel);
          }}
        />
      </div>
      {state.readError !== null && (
        <Notice tone="danger" title="Nothing was imported" live>
          {state.readError}
        </Notice>
      )}
      {mapping !== null && (
        <MappingForm
          mapping={mapping}
          headers={state.headers}
          onChange={changeMapping}
          disabled={busy}
        />
      )}
      {progress !== null && <ImportProgressBar progress={progress} />}
      {parsed !== null && parsed.errorCount > 0 && (
        <ImportErrors errors={parsed.errors} errorCount={parsed.errorCount} />
      )}
      {good !== null && <ImportPreview readings={good} />}
      {saveError !== null && (
        <Notice tone="danger" title="Nothing was imported" live>
          {saveError}
        </Notice>
      )}
      {file !== null && (
        <div className="flex flex-wrap items-center gap-3">
          <Button
            tone="primary"
            disabled={good === null || busy || crateMissing}
            onClick={() => void save()}
          >
            {good === null ? "Import readings" : `Import ${count.format(readings)} readings`}
          </Button>
          {crateMissing && good !== null && (
            <span className="text-muted">Choose the crate first.</span>
          )}
        </div>
      )}
    </div>
  );
}
