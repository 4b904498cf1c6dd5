// The control for one checklist item, by its kind; every answer is recorded as a new result.
import { useState, type ChangeEvent } from "react";
import type { ChecklistItem, ChecklistValue } from "../../../../shared/schemas/checklists";
import { describeRange } from "../../../../shared/checklists";
import { Button, buttonClasses } from "../../../components/button";
import { TextAreaField, TextField } from "../../../components/form-field";
import { parseDecimal } from "../../../lib/format";

interface ItemInputProps {
  item: ChecklistItem;
  current: ChecklistValue | undefined;
  disabled: boolean;
  onValue: (value: ChecklistValue) => Promise<void>;
  onPhoto: (file: File) => Promise<void>;
}

function Choices({
  options,
  current,
  disabled,
  onValue,
}: {
  options: readonly { label: string; value: ChecklistValue }[];
  current: ChecklistValue | undefined;
  disabled: boolean;
  onValue: (value: ChecklistValue) => Promise<void>;
}) {
  return (
    <div className="flex flex-wrap gap-2">
      {options.map((option) => (
        <Button
          key={option.label}
          tone={current === option.value ? "primary" : "secondary"}
          aria-pressed={current === option.value}
          disabled={disabled}
          onClick={() => void onValue(option.value)}
        >
          {option.label}
        </Button>
      ))}
    </div>
  );
}

function NumberInput({
  item,
  current,
  disabled,
  onValue,
}: ItemInputProps & { item: Extract<ChecklistItem, { kind: "number" }> }) {
  const [text, setText] = useState(current === undefined ? "" : String(current));
  const [error, setError] = useState<string | undefined>();
  const range = describeRange(item);
  const save = () => {
    const value = parseDecimal(text);
    if (!Number.isFinite(value)) {
      setError("Enter a number, e.g. 21.5");
      return;
    }
    setError(undefined);
    void onValue(value);
  };
  return (
    <form
      className="flex flex-wrap items-end gap-3"
      onSubmit={(event) => {
        event.preventDefault();
        save();
      }}
    >
      <TextField
        label="Value"
        unit={item.unit || undefined}
        inputMode="decimal"
        hint={range === "" ? undefined : `Allowed: ${range}`}
        error={error}
        value={text}
        disabled={disabled}
        onChange={(e) => setText(e.target.value)}
      />
      <Button type="submit" tone="primary" disabled={disabled}>
        Save
      </Button>
    </form>
  );
}

function TextInput({ current, disabled, onValue }: ItemInputProps) {
  const [text, setText] = useState(typeof current === "string" ? current : "");
  return (
    <form
      className="flex flex-col gap-2"
      onSubmit={(event) => {
        event.preventDefault();
        void onValue(text.trim());
      }}
    >
      <TextAreaField
        label="Text"
        value={text}
        disabled={disabled}
        maxLength={2000}
        onChange={(e) => setText(e.target.value)}
      />
      <div>
        <Button type="submit" tone="primary" disabled={disabled}>
          Save
        </Button>
      </div>
    </form>
  );
}

function PhotoInput({ disabled, onPhoto }: ItemInputProps) {
  const onPicked = (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    event.target.value = "";
    if (file) void onPhoto(file);
  };
  return (
    <label
      className={buttonClasses(
        "primary",
        "cursor-pointer self-start focus-within:outline focus-within:outline-4",
      )}
    >
      <input
        type="file"
        accept="image/*"
        capture="environment"
        className="sr-only"
        disabled={disabled}
        onChange={onPicked}
      />
      Take photo
    </label>
  );
}

export function ChecklistItemInput(props: ItemInputProps) {
  const { item } = props;
  switch (item.kind) {
    case "check":
      return (
        <Choices
          options={[
            { label: "Done", value: true },
            { label: "Not done", value: false },
          ]}
          {...props}
        />
      );
    case "choice":
      return <Choices options={item.options.map((o) => ({ label: o, value: o }))} {...props} />;
    case "number":
      return <NumberInput {...props} item={item} />;
    case "text":
      return <TextInput {...props} />;
    case "photo":
      return <PhotoInput {...props} />;
  }
}
