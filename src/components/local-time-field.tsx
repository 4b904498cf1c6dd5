// A time typed in the tablet's local time, shown with its UTC value beside it (DESIGN.md §8), and
// a time shown the same way.
import { formatLocalBeside, formatUtc } from "../lib/format";
import { fromLocalInput } from "../lib/local-time";
import { TextField } from "./form-field";

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

/** "2027-06-10 06:10 UTC · 08:10 local" */
export function TimeText({ iso }: { iso: string }) {
  return (
    <span className="tabular-nums">
      <time dateTime={iso}>{formatUtc(iso)}</time>
      <span className="text-muted"> · {formatLocalBeside(iso)}</span>
    </span>
  );
}
