// Two steps, so that a gloved tap never deletes by accident: the button, then the question with
// what deleting does, and the server's refusal in words when there is one.
import { useState, type ReactNode } from "react";
import { messageOf } from "../lib/api-error";
import { Button } from "./button";
import { Notice } from "./notice";

interface Props {
  /** "Delete benchmark…" */
  label: string;
  question: string;
  /** What deleting does and what stays. */
  children: ReactNode;
  pending: boolean;
  error: unknown;
  onConfirm: () => void;
}

export function ConfirmDelete({ label, question, children, pending, error, onConfirm }: Props) {
  const [confirming, setConfirming] = useState(false);
  if (!confirming)
    return (
      <div>
        <Button tone="danger" onClick={() => setConfirming(true)}>
          {label}
        </Button>
      </div>
    );
  return (
    <div className="flex flex-col gap-3 rounded-lg border-2 border-danger bg-surface p-4">
      <p className="font-semibold">{question}</p>
      <p className="text-muted">{children}</p>
      {error != null && (
        <Notice tone="danger" title="Not deleted" live>
          {messageOf(error)}
        </Notice>
      )}
      <div className="flex flex-wrap gap-3">
        <Button tone="danger" disabled={pending} onClick={onConfirm}>
          {pending ? "Deleting…" : "Yes, delete"}
        </Button>
        <Button onClick={() => setConfirming(false)}>Keep it</Button>
      </div>
    </div>
  );
}
