// Recording a handover: the crate (typed label or scanned), who gives it (the current holder by the
// chain), who receives it (their typed name is the signature), when, where, and in what state.
import { useMemo, useState, type ReactNode } from "react";
import type { CrateView } from "../../../../shared/schemas/crates";
import {
  handoverConditionLabels,
  handoverConditions,
  legState,
  logisticsLimits,
  type HandoverCondition,
} from "../../../../shared/schemas/logistics";
import type { LocalHandover, LocalLeg, LocalSite } from "../../../db/database";
import { currentHolder } from "../../../db/logistics-queries";
import { LogisticsInputError } from "../../../db/logistics-store";
import { Button } from "../../../components/button";
import { SelectField, TextAreaField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { StatusShape } from "../../../components/status-shape";
import { messageOf } from "../../../lib/api-error";
import { fromLocalInput, toLocalInput } from "../../../lib/local-time";
import { useLogisticsWrites } from "../hooks/use-logistics";
import { CrateCautions } from "./crate-cautions";
import { LocalTimeField } from "../../../components/local-time-field";

interface Props {
  campaignId: string;
  crates: readonly CrateView[];
  handovers: readonly LocalHandover[];
  legs: readonly LocalLeg[];
  sites: readonly LocalSite[];
  initialCrateId?: string;
  /** A label scanner, when the app has one: it calls back with the label read. */
  scanner?: (onLabel: (label: string) => void) => ReactNode;
  onSaved: (handoverId: string) => void;
}

const findByLabel = (crates: readonly CrateView[], label: string) =>
  crates.find((c) => c.label.trim().toLowerCase() === label.trim().toLowerCase()) ?? null;

export function HandoverForm(props: Props) {
  const { campaignId, crates, handovers, legs, sites, initialCrateId, scanner, onSaved } = props;
  const writes = useLogisticsWrites(campaignId);
  const initial = crates.find((c) => c.id === initialCrateId);
  const [label, setLabel] = useState(initial?.label ?? "");
  const crate = findByLabel(crates, label);
  const chain = useMemo(
    () => handovers.filter((h) => h.crateId === crate?.id),
    [handovers, crate?.id],
  );
  const crateLegs = legs.filter((l) => l.crateId === crate?.id && legState(l) !== "cancelled");
  const holder = currentHolder(chain);
  // The giver follows the chain until the person types over it.
  const [fromTyped, setFromTyped] = useState<string | null>(null);
  const fromName = fromTyped ?? holder ?? "";
  const [toName, setToName] = useState("");
  const [at, setAt] = useState(() => toLocalInput(new Date()));
  const [legChoice, setLegChoice] = useState<string | null>(null);
  const lastArrived = [...crateLegs].reverse().find((l) => l.arrivedAt !== null);
  const legId = legChoice ?? lastArrived?.id ?? "";
  const [siteId, setSiteId] = useState("");
  const [place, setPlace] = useState("");
  const [condition, setCondition] = useState<HandoverCondition | "">("");
  const [note, setNote] = useState("");
  const [errors, setErrors] = useState<Partial<Record<string, string>>>({});
  const [failure, setFailure] = useState<string | null>(null);

  const submit = async () => {
    setErrors({});
    setFailure(null);
    if (crate === null) {
      setErrors({
        crateId: label.trim() === "" ? "Choose the crate" : `No crate labelled ${label.trim()}`,
      });
      return;
    }
    if (condition === "") {
      setErrors({ condition: "Choose the crate's condition" });
      return;
    }
    try {
      const id = await writes.handover({
        crateId: crate.id,
        legId: legId === "" ? null : legId,
        fromName,
        toName,
        at: fromLocalInput(at),
        siteId: siteId === "" ? null : siteId,
        place,
        condition,
        note,
      });
      onSaved(id);
    } catch (error) {
      if (error instanceof LogisticsInputError && error.field !== "" && error.field !== "id")
        setErrors({ [error.field]: error.message });
      else setFailure(messageOf(error));
    }
  };
  const siteName = (id: string) => sites.find((s) => s.id === id)?.name ?? "a site";

  return (
    <div className="flex flex-col gap-4">
      {scanner !== undefined && (
        <section
          aria-labelledby="handover-scan"
          className="rounded-xl border-2 border-line bg-surface p-4"
        >
          <h2 id="handover-scan" className="mb-3 text-xl font-semibold">
            Scan the crate&apos;s label
          </h2>
          {scanner((read) => {
            setLabel(read);
            setFromTyped(null);
            setLegChoice(null);
          })}
        </section>
      )}
      <form
        aria-labelledby="handover-form"
        className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
        onSubmit={(e) => {
          e.preventDefault();
          void submit();
        }}
        noValidate
      >
        <h2 id="handover-form" className="text-xl font-semibold">
          Handover
        </h2>
        <div className="grid gap-4 md:grid-cols-2">
          <div className="flex flex-col gap-2">
            <TextField
              label="Crate label"
              hint="As printed on the crate, e.g. KR-03"
              value={label}
              list="handover-crate-labels"
              maxLength={logisticsLimits.labelMax}
              autoComplete="off"
              onChange={(e) => {
                setLabel(e.target.value);
                setFromTyped(null);
                setLegChoice(null);
              }}
              error={errors.crateId}
            />
            <datalist id="handover-crate-labels">
              {crates.map((c) => (
                <option key={c.id} value={c.label} />
              ))}
            </datalist>
            {crate !== null && (
              <p className="flex items-center gap-2">
                <StatusShape shape="disc" className="text-primary" />
                {crate.label}: {crate.contents}
              </p>
            )}
          </div>
          {crateLegs.length > 0 && (
            <SelectField
              label="Leg (optional)"
              value={legId}
              onChange={(e) => setLegChoice(e.target.value)}
              error={errors.legId}
            >
              <option value="">Not part of a leg</option>
              {crateLegs.map((l) => (
                <option key={l.id} value={l.id}>
                  {siteName(l.fromSiteId)} → {siteName(l.toSiteId)}
                </option>
              ))}
            </SelectField>
          )}
          <TextField
            label="Handed over by"
            hint={
              holder === null
                ? "The first handover of this crate"
                : `The crate is with ${holder} by the chain`
            }
            value={fromName}
            maxLength={logisticsLimits.nameMax}
            onChange={(e) => setFromTyped(e.target.value)}
            error={errors.fromName}
          />
          <TextField
            label="Received by (typed name)"
            hint="The receiver types their own name: this is their signature"
            value={toName}
            maxLength={logisticsLimits.nameMax}
            onChange={(e) => setToName(e.target.value)}
            error={errors.toName}
          />
          <LocalTimeField label="Time" value={at} onChange={setAt} error={errors.at} />
          <SelectField
            label="Site (optional)"
            value={siteId}
            onChange={(e) => setSiteId(e.target.value)}
            error={errors.siteId}
          >
            <option value="">Not at a site</option>
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </SelectField>
          <TextField
            label="Place (optional)"
            hint="e.g. cable car valley station"
            value={place}
            maxLength={logisticsLimits.textMax}
            onChange={(e) => setPlace(e.target.value)}
            error={errors.place}
          />
        </div>
        <fieldset
          className="flex flex-col gap-2"
          aria-describedby={errors.condition ? "condition-error" : undefined}
        >
          <legend className="font-semibold">Condition</legend>
          {handoverConditions.map((c) => (
            <label key={c} className="flex min-h-touch items-center gap-3">
              <input
                type="radio"
                name="condition"
                value={c}
                checked={condition === c}
                onChange={() => setCondition(c)}
                className="h-6 w-6"
              />
              {handoverConditionLabels[c]}
            </label>
          ))}
          {errors.condition !== undefined && (
            <p
              id="condition-error"
              className="flex items-start gap-2 font-semibold text-danger-ink"
            >
              <StatusShape shape="octagon" className="mt-0.5 text-danger" />
              {errors.condition}
            </p>
          )}
        </fieldset>
        <TextAreaField
          label="Note (optional)"
          value={note}
          maxLength={logisticsLimits.noteMax}
          onChange={(e) => setNote(e.target.value)}
          error={errors.note}
        />
        {crate !== null && <CrateCautions crate={crate} />}
        <div>
          <Button type="submit" tone="primary">
            Record handover
          </Button>
        </div>
        {failure !== null && (
          <Notice tone="danger" title="Not recorded" live>
            {failure}
          </Notice>
        )}
      </form>
    </div>
  );
}
