import type { ReactNode } from "react";
import { LinkButton } from "../components/button";
import { Notice } from "../components/notice";

interface NotFoundHereProps {
  title: string;
  children: ReactNode;
  backHref: string;
}

/** Shown when a record reached by its address is not in this device's store (or was deleted). */
export function NotFoundHere({ title, children, backHref }: NotFoundHereProps) {
  return (
    <div className="flex flex-col gap-4">
      <Notice tone="attention" title={title}>
        {children}
      </Notice>
      <div>
        <LinkButton to={backHref}>Back to the sites</LinkButton>
      </div>
    </div>
  );
}
