import { Outlet } from "react-router-dom";
import { AppHeader } from "../app-header";

/** Sign-in and invite pages: the header (with settings, for sunlight) and one narrow column. */
export function PublicLayout() {
  return (
    <div className="flex min-h-dvh flex-col">
      <AppHeader />
      <main id="main" className="mx-auto w-full max-w-xl flex-1 px-4 py-8 md:py-12">
        <Outlet />
      </main>
    </div>
  );
}
