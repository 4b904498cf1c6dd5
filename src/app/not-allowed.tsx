import { LinkButton } from "../components/button";
import { Notice } from "../components/notice";

interface NotAllowedProps {
  what: string;
  backHref: string;
}

/** Shown when a role may not use a page reached by its address. */
export function NotAllowed({ what, backHref }: NotAllowedProps) {
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="attention" title="Not available for your role">
        {what}
      </Notice>
      <div>
        <LinkButton to={backHref}>Back to the sites</LinkButton>
      </div>
    </div>
  );
}
