// Refused by the server while a comparison run uses the instrument: the answer names the run.
import type { InstrumentView } from "../../../../shared/schemas/instruments";
import { ConfirmDelete } from "../../../components/confirm-delete";
import { useDeleteInstrument } from "../api/delete-instrument";

interface Props {
  campaignId: string;
  instrument: InstrumentView;
  onDeleted: () => void;
}

export function DeleteInstrumentControl({ campaignId, instrument, onDeleted }: Props) {
  const removing = useDeleteInstrument(campaignId);
  return (
    <ConfirmDelete
      label="Delete instrument…"
      question={`Delete ${instrument.name}?`}
      pending={removing.isPending}
      error={removing.error}
      onConfirm={() => removing.mutate(instrument.id, { onSuccess: onDeleted })}
    >
      It leaves the campaign’s list of clocks and links; its history stays in the audit trail. A
      comparison run that uses it must let it go first.
    </ConfirmDelete>
  );
}
