// The column mapping, prefilled by the guess or the logger model's remembered mapping; every change
// re-reads the file at once so the preview and the errors follow.
import type { ReactNode } from "react";
import { SelectField } from "../../../components/form-field";
import {
  delimiterLabels,
  delimiters,
  timeFormatExamples,
  timeFormatLabels,
  timeFormats,
  type ColumnMapping,
  type Delimiter,
  type ShockColumns,
  type TemperatureColumns,
  type TimeFormat,
} from "../parse/mapping";
import { formatOffset } from "../parse/time";
import {
  accelerationUnitLabels,
  accelerationUnits,
  temperatureUnitLabels,
  temperatureUnits,
  type AccelerationUnit,
  type TemperatureUnit,
} from "../parse/units";

const none = "";
const headerLines = Array.from({ length: 30 }, (_, i) => i + 1);
const offsets = Array.from({ length: (26 * 60) / 15 + 1 }, (_, i) => -12 * 60 + i * 15);

interface MappingFormProps {
  mapping: ColumnMapping;
  headers: readonly string[];
  onChange: (mapping: ColumnMapping) => void;
  disabled?: boolean;
}

function ColumnSelect({
  label,
  value,
  headers,
  optional,
  onChange,
  disabled,
}: {
  label: string;
  value: string | null;
  headers: readonly string[];
  optional: boolean;
  onChange: (column: string | null) => void;
  disabled: boolean;
}) {
  const missing = value !== null && value !== none && !headers.includes(value);
  return (
    <SelectField
      label={label}
      value={value ?? none}
      disabled={disabled}
      error={missing ? `"${value}" is not in this file's header` : undefined}
      onChange={(e) => onChange(e.target.value === none ? null : e.target.value)}
    >
      <option value={none}>{optional ? "— not in this file —" : "— choose a column —"}</option>
      {missing && <option value={value}>{value}</option>}
      {headers.map((h) => (
        <option key={h} value={h}>
          {h}
        </option>
      ))}
    </SelectField>
  );
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="grid gap-4 rounded-xl border-2 border-line p-4 sm:grid-cols-2 lg:grid-cols-3">
      <legend className="px-1 font-semibold">{title}</legend>
      {children}
    </fieldset>
  );
}

export function MappingForm({ mapping, headers, onChange, disabled = false }: MappingFormProps) {
  const set = (patch: Partial<ColumnMapping>) => onChange({ ...mapping, ...patch });
  const setTime = (patch: Partial<ColumnMapping["time"]>) =>
    set({ time: { ...mapping.time, ...patch } });
  const v = mapping.values;
  const setTemperature = (patch: Partial<TemperatureColumns>) =>
    v.kind === "temperatures" && set({ values: { ...v, ...patch } });
  const setShock = (patch: Partial<ShockColumns>) =>
    v.kind === "shock-log" && set({ values: { ...v, ...patch } });
  const column = (
    label: string,
    value: string | null,
    optional: boolean,
    apply: (c: string | null) => void,
  ) => (
    <ColumnSelect
      label={label}
      value={value}
      headers={headers}
      optional={optional}
      onChange={apply}
      disabled={disabled}
    />
  );

  return (
    <div className="flex flex-col gap-4">
      <Group title="File layout">
        <SelectField
          label="Header on line"
          value={String(mapping.headerLine)}
          disabled={disabled}
          onChange={(e) => set({ headerLine: Number(e.target.value) })}
        >
          {headerLines.map((line) => (
            <option key={line} value={line}>
              {line}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Delimiter"
          value={mapping.delimiter}
          disabled={disabled}
          onChange={(e) => set({ delimiter: e.target.value as Delimiter })}
        >
          {delimiters.map((d) => (
            <option key={d} value={d}>
              {delimiterLabels[d]}
            </option>
          ))}
        </SelectField>
        <SelectField
          label="Decimal separator"
          value={mapping.decimalSeparator}
          disabled={disabled}
          onChange={(e) => set({ decimalSeparator: e.target.value === "," ? "," : "." })}
        >
          <option value=".">Point (21.5)</option>
          <option value=",">Comma (21,5)</option>
        </SelectField>
      </Group>
      <Group title="Time">
        {column("Time column", mapping.time.column, false, (c) => setTime({ column: c ?? "" }))}
        <SelectField
          label="Time format"
          hint={`For example ${timeFormatExamples[mapping.time.format]}`}
          value={mapping.time.format}
          disabled={disabled}
          onChange={(e) => setTime({ format: e.target.value as TimeFormat })}
        >
          {timeFormats.map((f) => (
            <option key={f} value={f}>
              {timeFormatLabels[f]}
            </option>
          ))}
        </SelectField>
        {mapping.time.format === "local" && (
          <SelectField
            label="The logger's clock runs at"
            hint="The offset from UTC the logger's clock was set to."
            value={String(mapping.time.utcOffsetMinutes)}
            disabled={disabled}
            onChange={(e) => setTime({ utcOffsetMinutes: Number(e.target.value) })}
          >
            {offsets.map((m) => (
              <option key={m} value={m}>
                UTC{formatOffset(m)}
              </option>
            ))}
          </SelectField>
        )}
      </Group>
      {v.kind === "temperatures" ? (
        <Group title="Values">
          {column("Temperature column", v.temperature, false, (c) =>
            setTemperature({ temperature: c ?? "" }),
          )}
          <SelectField
            label="Temperature unit"
            value={v.temperatureUnit}
            disabled={disabled}
            onChange={(e) => setTemperature({ temperatureUnit: e.target.value as TemperatureUnit })}
          >
            {temperatureUnits.map((u) => (
              <option key={u} value={u}>
                {temperatureUnitLabels[u]}
              </option>
            ))}
          </SelectField>
          {column("Relative humidity column (%)", v.humidity, true, (c) =>
            setTemperature({ humidity: c }),
          )}
        </Group>
      ) : (
        <Group title="Values">
          {column("Peak x column", v.x, true, (c) => setShock({ x: c }))}
          {column("Peak y column", v.y, true, (c) => setShock({ y: c }))}
          {column("Peak z column", v.z, true, (c) => setShock({ z: c }))}
          <SelectField
            label="Acceleration unit"
            value={v.accelerationUnit}
            disabled={disabled}
            onChange={(e) => setShock({ accelerationUnit: e.target.value as AccelerationUnit })}
          >
            {accelerationUnits.map((u) => (
              <option key={u} value={u}>
                {accelerationUnitLabels[u]}
              </option>
            ))}
          </SelectField>
          {column("Pulse duration column (ms)", v.duration, true, (c) => setShock({ duration: c }))}
        </Group>
      )}
    </div>
  );
}
