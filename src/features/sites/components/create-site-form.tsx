import { useSiteWrites } from "../hooks/use-local-sites";
import { SiteForm, type SiteFormOutput } from "./site-form";

interface CreateSiteFormProps {
  campaignId: string;
  cancelHref: string;
  /** Called once the new site is committed on this device. */
  onCreated: (name: string) => void;
}

export function CreateSiteForm({ campaignId, cancelHref, onCreated }: CreateSiteFormProps) {
  const writes = useSiteWrites(campaignId);
  const save = async (values: SiteFormOutput) => {
    await writes.create(values);
    onCreated(values.name);
  };
  return (
    <SiteForm
      defaultValues={{ name: "", notes: "" }}
      submitLabel="Add site"
      cancelHref={cancelHref}
      onSave={save}
    />
  );
}
