import { useNavigate, useParams } from "react-router-dom";
import { AcceptInviteForm } from "../../features/auth/components/accept-invite-form";
import { LinkButton } from "../../components/button";
import { Notice } from "../../components/notice";
import { useSession } from "../../lib/use-session";
import { paths } from "../paths";

export function InviteRoute() {
  const { token = "" } = useParams();
  const navigate = useNavigate();
  const session = useSession();

  return (
    <div className="flex flex-col gap-8">
      <div>
        <h1 className="text-3xl font-semibold tracking-tight">Join a campaign</h1>
        <p className="mt-1 text-muted">Choose your name as others will see it, and a password.</p>
      </div>
      {session.status === "signed-in" && (
        <Notice tone="attention" title="Already signed in">
          You are signed in as {session.user.email}. Accepting this invite signs you in as the
          invited person instead.
        </Notice>
      )}
      <div className="rounded-xl border-2 border-line bg-surface p-5 md:p-6">
        <AcceptInviteForm
          token={token}
          onAccepted={() => navigate(paths.campaigns, { replace: true })}
        />
      </div>
      <p>
        <LinkButton tone="quiet" to={paths.signIn}>
          I already have an account
        </LinkButton>
      </p>
    </div>
  );
}
