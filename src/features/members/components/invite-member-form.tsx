import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { roleLabels, roles } from "../../../../shared/permissions";
import { inviteInput, type InviteInput } from "../../../../shared/schemas";
import { Button } from "../../../components/button";
import { SelectField, TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { applyServerErrors } from "../../../lib/form-errors";
import { formatUtc } from "../../../lib/format";
import { useCreateInvite, type InviteView } from "../api/create-invite";

export function InviteMemberForm({ campaignId }: { campaignId: string }) {
  const createInvite = useCreateInvite(campaignId);
  const [sent, setSent] = useState<InviteView | null>(null);
  const [formMessage, setFormMessage] = useState<string | null>(null);
  const { register, handleSubmit, formState, setError, reset } = useForm<InviteInput>({
    resolver: zodResolver(inviteInput),
    defaultValues: { email: "", role: "field" },
  });
  const { errors } = formState;

  const submit = handleSubmit((values) => {
    setFormMessage(null);
    setSent(null);
    createInvite.mutate(values, {
      onSuccess: (invite) => {
        setSent(invite);
        reset({ email: "", role: values.role });
      },
      onError: (error) => setFormMessage(applyServerErrors(error, ["email", "role"], setError)),
    });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5" aria-label="Invite a member">
      {sent !== null && (
        <Notice title="Invite sent" live>
          {sent.email} is invited as {roleLabels[sent.role]}. The link works until{" "}
          <span className="tabular-nums">{formatUtc(sent.expiresAt)}</span>.
        </Notice>
      )}
      {formMessage !== null && (
        <Notice tone="danger" title="Invite not sent" live>
          {formMessage}
        </Notice>
      )}
      <div className="grid gap-5 md:grid-cols-[2fr_1fr]">
        <TextField
          label="E-mail"
          type="email"
          inputMode="email"
          autoCapitalize="none"
          spellCheck={false}
          error={errors.email?.message}
          {...register("email")}
        />
        <SelectField label="Role" error={errors.role?.message} {...register("role")}>
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </SelectField>
      </div>
      <div>
        <Button tone="primary" type="submit" disabled={createInvite.isPending}>
          {createInvite.isPending ? "Sending…" : "Send invite"}
        </Button>
      </div>
    </form>
  );
}
