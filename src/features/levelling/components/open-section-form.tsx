// Opening a section: its two marks, the class it is levelled to and the instrument.
import { useState } from "react";
import { FGCC_1984_LEVELLING_CLASSES } from "../../../../shared/science/levelling/misclosure";
import { levellingLimits } from "../../../../shared/schemas/levelling";
import { LevellingInputError } from "../../../db/levelling-store";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useLevellingWrites } from "../hooks/use-levelling";

interface OpenSectionFormProps {
  campaignId: string;
  siteId: string;
  onOpened: (sectionId: string) => void;
}

const defaultClass = "fgcc-1984-second-order-class-i";

export function OpenSectionForm({ campaignId, siteId, onOpened }: OpenSectionFormProps) {
  const writes = useLevellingWrites(campaignId);
  const [fromMark, setFromMark] = useState("");
  const [toMark, setToMark] = useState("");
  const [classId, setClassId] = useState(defaultClass);
  const [instrument, setInstrument] = useState("");
  const [errors, setErrors] = useState<Partial<Record<string, string>>>({});
  const [failure, setFailure] = useState<string | null>(null);

  const submit = async () => {
    setErrors({});
    setFailure(null);
    try {
      onOpened(await writes.open({ siteId, fromMark, toMark, classId, instrument }));
    } catch (error) {
      if (error instanceof LevellingInputError && error.field !== "siteId")
        setErrors({ [error.field]: error.message });
      else setFailure(messageOf(error));
    }
  };

  return (
    <form
      aria-labelledby="open-section"
      className="flex flex-col gap-4 rounded-xl border-2 border-line bg-surface p-4"
      onSubmit={(event) => {
        event.preventDefault();
        void submit();
      }}
      noValidate
    >
      <h2 id="open-section" className="text-xl font-semibold">
        Open a section
      </h2>
      <div className="grid grid-cols-2 gap-4">
        <TextField
          label="From mark"
          hint="Where the forward run starts, e.g. the clock's reference point"
          value={fromMark}
          maxLength={levellingLimits.markMax}
          onChange={(e) => setFromMark(e.target.value)}
          error={errors.fromMark}
        />
        <TextField
          label="To mark"
          hint="Where it ends, e.g. a benchmark"
          value={toMark}
          maxLength={levellingLimits.markMax}
          onChange={(e) => setToMark(e.target.value)}
          error={errors.toMark}
        />
        <SelectField
          label="Levelling class"
          hint="Sets the allowed misclosure k·√K"
          value={classId}
          onChange={(e) => setClassId(e.target.value)}
          error={errors.classId}
        >
          {FGCC_1984_LEVELLING_CLASSES.map((c) => (
            <option key={c.id} value={c.id}>
              {c.name} (±{c.sectionKMm} mm·√K)
            </option>
          ))}
        </SelectField>
        <TextField
          label="Instrument (optional)"
          value={instrument}
          maxLength={120}
          onChange={(e) => setInstrument(e.target.value)}
          error={errors.instrument}
        />
      </div>
      <div>
        <Button type="submit" tone="primary">
          Open section
        </Button>
      </div>
      {failure !== null && (
        <Notice tone="danger" title="Not opened" live>
          {failure}
        </Notice>
      )}
    </form>
  );
}
