// Planning a leg: which crate, from which site to which, the vehicle and the planned times.
import { useState } from "react";
import type { CrateView } from "../../../../shared/schemas/crates";
import { logisticsLimits } from "../../../../shared/schemas/logistics";
import type { LocalSite } from "../../../db/database";
import { LogisticsInputError } from "../../../db/logistics-store";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { fromLocalInput } from "../../../lib/local-time";
import { useLogisticsWrites } from "../hooks/use-logistics";
import { LocalTimeField } from "../../../components/local-time-field";

interface Props {
  campaignId: string;
  crates: readonly CrateView[];
  sites: readonly LocalSite[];
  crateId?: string;
  onPlanned?: (legId: string) => void;
}

export function PlanLegForm({ campaignId, crates, sites, crateId: fixed, onPlanned }: Props) {
  const writes = useLogisticsWrites(campaignId);
  const [crateId, setCrateId] = useState(fixed ?? "");
  const [fromSiteId, setFrom] = useState("");
  const [toSiteId, setTo] = useState("");
  const [vehicle, setVehicle] = useState("");
  const [departAt, setDepartAt] = useState("");
  const [arriveAt, setArriveAt] = useState("");
  const [errors, setErrors] = useState<Partial<Record<string, string>>>({});
  const [message, setMessage] = useState<{ tone: "info" | "danger"; text: string } | null>(null);

  const submit = async () => {
    setErrors({});
    setMessage(null);
    try {
      const id = await writes.plan({
        crateId,
        fromSiteId,
        toSiteId,
        vehicle,
        plannedDepartAt: fromLocalInput(departAt),
        plannedArriveAt: fromLocalInput(arriveAt),
      });
      setMessage({ tone: "info", text: "Saved on this device; sent with the next sync." });
      setTo("");
      setFrom("");
      onPlanned?.(id);
    } catch (error) {
      if (error instanceof LogisticsInputError && error.field !== "" && error.field !== "id")
        setErrors({ [error.field]: error.message });
      else setMessage({ tone: "danger", text: messageOf(error) });
    }
  };

  const siteOptions = (
    <>
      <option value="">Choose a site</option>
      {sites.map((s) => (
        <option key={s.id} value={s.id}>
          {s.name}
        </option>
      ))}
    </>
  );
  return (
    <form
      aria-labelledby="plan-leg"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
      noValidate
    >
      <h2 id="plan-leg" className="text-xl font-semibold">
        Plan a leg
      </h2>
      <div className="grid gap-4 md:grid-cols-2">
        {fixed === undefined && (
          <SelectField
            label="Crate"
            value={crateId}
            onChange={(e) => setCrateId(e.target.value)}
            error={errors.crateId}
          >
            <option value="">Choose a crate</option>
            {crates.map((c) => (
              <option key={c.id} value={c.id}>
                {c.label} — {c.contents}
              </option>
            ))}
          </SelectField>
        )}
        <TextField
          label="Vehicle or carrier (optional)"
          value={vehicle}
          maxLength={logisticsLimits.textMax}
          onChange={(e) => setVehicle(e.target.value)}
          error={errors.vehicle}
        />
        <SelectField
          label="From"
          value={fromSiteId}
          onChange={(e) => setFrom(e.target.value)}
          error={errors.fromSiteId}
        >
          {siteOptions}
        </SelectField>
        <SelectField
          label="To"
          value={toSiteId}
          onChange={(e) => setTo(e.target.value)}
          error={errors.toSiteId}
        >
          {siteOptions}
        </SelectField>
        <LocalTimeField
          label="Planned departure"
          value={departAt}
          onChange={setDepartAt}
          error={errors.plannedDepartAt}
        />
        <LocalTimeField
          label="Planned arrival"
          value={arriveAt}
          onChange={setArriveAt}
          error={errors.plannedArriveAt}
        />
      </div>
      <div>
        <Button type="submit" tone="primary">
          Plan leg
        </Button>
      </div>
      {message !== null && (
        <Notice
          tone={message.tone}
          title={message.tone === "info" ? "Leg planned" : "Not planned"}
          live
        >
          {message.text}
        </Notice>
      )}
    </form>
  );
}
