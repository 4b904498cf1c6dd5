// The queue's filters: which records (waiting or by decision), of which kind, where, whose, when.
import {
  reviewSubjectKinds,
  reviewSubjectLabels,
  type ReviewQueueQuery,
} from "../../../../shared/schemas/reviews";
import { SelectField, TextField } from "../../../components/form-field";

export type QueueShow = NonNullable<ReviewQueueQuery["show"]>;

export const showLabels: Record<QueueShow, string> = {
  waiting: "Waiting for review",
  approved: "Approved",
  sentBack: "Sent back",
  all: "Everything",
};

interface ReviewFiltersProps {
  value: ReviewQueueQuery;
  onChange: (next: ReviewQueueQuery) => void;
  sites: { id: string; name: string }[];
  people: { id: string; name: string }[];
}

export function ReviewFilters({ value, onChange, sites, people }: ReviewFiltersProps) {
  const set = (patch: Partial<ReviewQueueQuery>) => onChange({ ...value, ...patch });
  const orNone = (v: string) => (v === "" ? undefined : v);
  return (
    <fieldset className="grid grid-cols-1 gap-4 rounded-lg border-2 border-line p-4 sm:grid-cols-3">
      <legend className="px-1 font-semibold">Filters</legend>
      <SelectField
        label="Show"
        value={value.show ?? "waiting"}
        onChange={(e) => set({ show: e.target.value as QueueShow })}
      >
        {(Object.keys(showLabels) as QueueShow[]).map((show) => (
          <option key={show} value={show}>
            {showLabels[show]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Kind"
        value={value.kind ?? ""}
        onChange={(e) =>
          set({ kind: orNone(e.target.value) as ReviewQueueQuery["kind"] | undefined })
        }
      >
        <option value="">Every kind</option>
        {reviewSubjectKinds.map((kind) => (
          <option key={kind} value={kind}>
            {reviewSubjectLabels[kind]}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Site"
        value={value.site ?? ""}
        onChange={(e) => set({ site: orNone(e.target.value) })}
      >
        <option value="">Every site</option>
        {sites.map((site) => (
          <option key={site.id} value={site.id}>
            {site.name}
          </option>
        ))}
      </SelectField>
      <SelectField
        label="Person"
        value={value.person ?? ""}
        onChange={(e) => set({ person: orNone(e.target.value) })}
      >
        <option value="">Everyone</option>
        {people.map((person) => (
          <option key={person.id} value={person.id}>
            {person.name}
          </option>
        ))}
      </SelectField>
      <TextField
        label="From"
        type="date"
        value={value.from ?? ""}
        onChange={(e) => set({ from: orNone(e.target.value) })}
      />
      <TextField
        label="To"
        type="date"
        value={value.to ?? ""}
        onChange={(e) => set({ to: orNone(e.target.value) })}
      />
    </fieldset>
  );
}
