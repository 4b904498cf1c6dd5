import { useCreateSite } from "../api/create-site";
import { SiteForm, type SiteFormOutput } from "./site-form";

interface CreateSiteFormProps {
  campaignId: string;
  cancelHref: string;
  onCreated: () => void;
}

function newSiteId(): string | undefined {
  // Made here so that a site keeps its identity once offline creation arrives (DESIGN.md §4).
  return typeof crypto.randomUUID === "function" ? crypto.randomUUID() : undefined;
}

export function CreateSiteForm({ campaignId, cancelHref, onCreated }: CreateSiteFormProps) {
  const createSite = useCreateSite(campaignId);
  const save = async (values: SiteFormOutput) => {
    await createSite.mutateAsync({ id: newSiteId(), ...values });
    onCreated();
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
