// Times typed in the tablet's local time (datetime-local inputs) and their UTC ISO 8601 form.
const pad = (v: number) => String(v).padStart(2, "0");

/** "2027-06-02T09:15" in local time, as a datetime-local input takes it. */
export const toLocalInput = (date: Date) =>
  `${date.getFullYear()}-${pad(date.getMonth() + 1)}-${pad(date.getDate())}T${pad(date.getHours())}:${pad(date.getMinutes())}`;

/** ISO 8601 in UTC, or the typed text itself (refused by the schema) when it is not a time. */
export function fromLocalInput(value: string): string {
  const date = new Date(value);
  return Number.isNaN(date.getTime()) ? value : date.toISOString();
}
