// The optional online tile layer, per device. Off unless someone types an address.
import { useState, type FormEvent } from "react";
import { Button } from "../../components/button";
import { TextField } from "../../components/form-field";
import { writeTileUrl } from "./tile-setting";

interface Props {
  url: string | null;
  onChange: (url: string | null) => void;
}

export function TileSettingForm({ url, onChange }: Props) {
  const [value, setValue] = useState(url ?? "");
  const [error, setError] = useState<string | undefined>(undefined);
  const [saved, setSaved] = useState<string | null>(null);

  function submit(event: FormEvent) {
    event.preventDefault();
    const result = writeTileUrl(window.localStorage, value);
    if (!result.ok) {
      setError(result.message);
      setSaved(null);
      return;
    }
    setError(undefined);
    setSaved(result.url === null ? "Online tiles are off." : "Saved on this device.");
    onChange(result.url);
  }

  return (
    <details className="rounded-lg border-2 border-line bg-surface p-3">
      <summary className="min-h-touch cursor-pointer content-center font-semibold">
        Map settings
      </summary>
      <form
        onSubmit={submit}
        noValidate
        aria-label="Online map tiles"
        className="mt-3 flex flex-col gap-3"
      >
        <TextField
          label="Online tile address (optional)"
          hint="An XYZ raster address with {z}, {x} and {y}, drawn under the outlines when this device is online. Leave empty to keep the map fully offline. Use only a tile service your team may use."
          value={value}
          inputMode="url"
          autoComplete="off"
          spellCheck={false}
          error={error}
          onChange={(e) => setValue(e.target.value)}
        />
        <div className="flex flex-wrap items-center gap-3">
          <Button type="submit">Save</Button>
          {saved !== null && <span role="status">{saved}</span>}
        </div>
      </form>
    </details>
  );
}
