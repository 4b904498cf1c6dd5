import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { signInInput } from "../../../../shared/schemas";
import { Button } from "../../../components/button";
import { TextField } from "../../../components/form-field";
import { Notice } from "../../../components/notice";
import { messageOf } from "../../../lib/api-error";
import { useSignIn } from "../api/sign-in";

interface SignInFormProps {
  onSignedIn: () => void;
}

export function SignInForm({ onSignedIn }: SignInFormProps) {
  const signIn = useSignIn();
  const { register, handleSubmit, formState } = useForm({
    resolver: zodResolver(signInInput),
    defaultValues: { email: "", password: "" },
  });
  const { errors } = formState;

  const submit = handleSubmit((values) => {
    signIn.mutate(values, { onSuccess: onSignedIn });
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-5" aria-label="Sign in">
      {signIn.isError && (
        <Notice tone="danger" title="Not signed in" live>
          {messageOf(signIn.error)}
        </Notice>
      )}
      <TextField
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        autoCapitalize="none"
        spellCheck={false}
        error={errors.email?.message}
        {...register("email")}
      />
      <TextField
        label="Password"
        type="password"
        autoComplete="current-password"
        error={errors.password?.message}
        {...register("password")}
      />
      <Button tone="primary" type="submit" disabled={signIn.isPending} className="w-full">
        {signIn.isPending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
