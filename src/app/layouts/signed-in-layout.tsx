import { Navigate, Outlet, useLocation } from "react-router-dom";
import { SyncBar } from "../../features/sync/components/sync-bar";
import { LinkButton } from "../../components/button";
import { useSession } from "../../lib/use-session";
import { AppFooter } from "../app-footer";
import { AppHeader } from "../app-header";
import { paths } from "../paths";
import { SignOutControl } from "../sign-out-control";
import { SyncProvider } from "../sync-provider";

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
      <SignOutControl />
    </div>
  );
  const deviceLink = (
    <LinkButton tone="quiet" to={paths.device} className="px-3">
      This device
    </LinkButton>
  );
  return (
    <SyncProvider key={session.user.id} userId={session.user.id}>
      <div className="flex min-h-dvh flex-col">
        <AppHeader checking={!session.verified} account={account} />
        <SyncBar deviceLink={deviceLink} />
        <main id="main" className="mx-auto w-full max-w-page flex-1 px-4 py-6 md:px-6">
          <Outlet />
        </main>
        <AppFooter />
      </div>
    </SyncProvider>
  );
}
