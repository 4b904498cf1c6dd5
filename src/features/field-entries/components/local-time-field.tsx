// A time typed in the tablet's local time, shown with its UTC value beside it (DESIGN.md §8).
import { TextField } from "../../../components/form-field";
import { formatUtc } from "../../../lib/format";

const pad = (v: number) => String(v).padStart(2, "0");

/** "2027-06-02T09:15" in local time, as a datetime-local input takes it. */
export const toLocalInput = (date: Date) =>
  `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;

/** ISO 8601 in UTC, or the typed text itself (refused by the schema) when it is not a time. */
export function fromLocalInput(value: string): string {
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? value : date.toISOString();
}

interface Props {
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
}

export function LocalTimeField({ label, value, onChange, error }: Props) {
  const iso = fromLocalInput(value);
  return (
    <TextField
      label={label}
      type="datetime-local"
      value={value}
      onChange={(e) => onChange(e.target.value)}
      hint={
        iso === value
          ? "Local time of this tablet"
          : `Local time of this tablet · ${formatUtc(iso)}`
      }
      error={error}
    />
  );
}
