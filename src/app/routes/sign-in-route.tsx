import { Navigate, useLocation, useNavigate } from "react-router-dom";
import { DemoAccountsNote } from "../../features/auth/components/demo-accounts-note";
import { SignInForm } from "../../features/auth/components/sign-in-form";
import { useHealth } from "../../features/health/api/get-health";
import { useSession } from "../../lib/use-session";
import { paths } from "../paths";

function returnPathOf(state: unknown): string {
  if (typeof state === "object" && state !== null && "from" in state) {
    const { from } = state;
    if (typeof from === "string" && from.startsWith("/") && from !== paths.signIn) return from;
  }
  return paths.campaigns;
}

export function SignInRoute() {
  const session = useSession();
  const location = useLocation();
  const navigate = useNavigate();
  const health = useHealth();
  const returnPath = returnPathOf(location.state);

  if (session.status === "signed-in") return <Navigate to={returnPath} replace />;
  return (
    <div className="flex flex-col gap-8">
      <div>
        <h1 className="text-3xl font-semibold tracking-tight">Sign in</h1>
        <p className="mt-1 text-muted">Campaign work for transportable optical clocks.</p>
      </div>
      <div className="rounded-xl border-2 border-line bg-surface p-5 md:p-6">
        <SignInForm onSignedIn={() => navigate(returnPath, { replace: true })} />
      </div>
      {health.data?.demo === true && <DemoAccountsNote />}
    </div>
  );
}
