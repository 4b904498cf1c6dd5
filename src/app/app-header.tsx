import type { ReactNode } from "react";
import { Link } from "react-router-dom";
import { BrandMark } from "../components/brand-mark";
import { ConnectionStatus } from "../components/connection-status";
import { SettingsMenu } from "../components/settings-menu";
import { useConnectivity } from "../lib/use-connectivity";
import { paths } from "./paths";

interface AppHeaderProps {
  /** True while a remembered session is not yet confirmed by the server. */
  checking?: boolean;
  /** Person and sign-out, when signed in. */
  account?: ReactNode;
}

export function AppHeader({ checking = false, account }: AppHeaderProps) {
  const connectivity = useConnectivity();
  return (
    <header className="border-b-2 border-line bg-surface">
      <div className="mx-auto flex max-w-page flex-wrap items-center gap-x-4 gap-y-2 px-4 py-2 md:px-6">
        <Link to={paths.home} className="flex min-h-touch items-center gap-3 no-underline">
          <BrandMark />
          <span className="text-2xl font-semibold tracking-tight">Equipot</span>
        </Link>
        <div className="ml-auto flex flex-wrap items-center gap-2">
          <ConnectionStatus connectivity={connectivity} checking={checking} />
          <SettingsMenu />
          {account}
        </div>
      </div>
    </header>
  );
}
