import { Navigate, Outlet, useLocation } from "react-router-dom";
import { SignOutButton } from "../../features/auth/components/sign-out-button";
import { useSession } from "../../lib/use-session";
import { AppFooter } from "../app-footer";
import { AppHeader } from "../app-header";
import { paths } from "../paths";

/** Everything behind sign-in. A remembered session opens it even with no network. */
export function SignedInLayout() {
  const session = useSession();
  const location = useLocation();

  if (session.status === "signed-out") {
    // Back to this page after signing in again, unless the person chose to sign out.
    const state = session.reason === "expired" ? { from: location.pathname } : undefined;
    return <Navigate to={paths.signIn} replace state={state} />;
  }
  const account = (
    <div className="flex items-center gap-3">
      <span className="hidden text-right leading-tight md:block">
        <span className="block font-semibold">{session.user.name}</span>
        <span className="block text-sm text-muted">{session.user.email}</span>
      </span>
      <SignOutButton />
    </div>
  );
  return (
    <div className="flex min-h-dvh flex-col">
      <AppHeader checking={!session.verified} account={account} />
      <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-6 md:px-6">
        <Outlet />
      </main>
      <AppFooter />
    </div>
  );
}
