import { useState } from "react";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { acceptInviteInput, limits } from "../../../../shared/schemas";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { applyServerErrors } from "../../../lib/form-errors";
import { useAcceptInvite } from "../api/accept-invite";

const acceptInviteForm = acceptInviteInput
  .omit({ token: true })
  .extend({ repeatPassword: z.string() })
  .refine((values) => values.password === values.repeatPassword, {
    path: ["repeatPassword"],
    message: "The two passwords differ",
  });

interface AcceptInviteFormProps {
  token: string;
  onAccepted: () => void;
}

export function AcceptInviteForm({ token, onAccepted }: AcceptInviteFormProps) {
  const accept = useAcceptInvite();
  const { register, handleSubmit, formState, setError } = useForm({
    resolver: zodResolver(acceptInviteForm),
    defaultValues: { name: "", password: "", repeatPassword: "" },
  });
  const { errors } = formState;
  const [formMessage, setFormMessage] = useState<string | null>(null);

  const submit = handleSubmit(({ name, password }) => {
    setFormMessage(null);
    accept.mutate(
      { token, name, password },
      {
        onSuccess: onAccepted,
        onError: (error) =>
          setFormMessage(applyServerErrors(error, ["name", "password"], setError)),
      },
    );
  });

  return (
    <form
      onSubmit={submit}
      noValidate
      className="flex flex-col gap-5"
      aria-label="Accept the invite"
    >
      {formMessage !== null && (
        <Notice tone="danger" title="Invite not accepted" live>
          {formMessage}
        </Notice>
      )}
      <TextField
        label="Your name"
        autoComplete="name"
        error={errors.name?.message}
        {...register("name")}
      />
      <TextField
        label="New password"
        type="password"
        autoComplete="new-password"
        hint={`At least ${limits.passwordMin} characters.`}
        error={errors.password?.message}
        {...register("password")}
      />
      <TextField
        label="Repeat the password"
        type="password"
        autoComplete="new-password"
        error={errors.repeatPassword?.message}
        {...register("repeatPassword")}
      />
      <Button tone="primary" type="submit" disabled={accept.isPending} className="w-full">
        {accept.isPending ? "Joining…" : "Join the campaign"}
      </Button>
    </form>
  );
}
