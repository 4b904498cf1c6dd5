import { Button } from "../../../components/button";
import { useSignOut } from "../api/sign-out";

export function SignOutButton() {
  const signOut = useSignOut();
  return (
    <Button tone="secondary" onClick={() => signOut.mutate()} disabled={signOut.isPending}>
      {signOut.isPending ? "Signing out…" : "Sign out"}
    </Button>
  );
}
