import { useEffect, useState } from "react";
import { isRouteErrorResponse, useRouteError } from "react-router-dom";
import { messageOf } from "../../lib/api-error";
import { reloadForStaleChunk, shouldReloadForStaleChunk } from "../../lib/stale-chunk";

/** Never a blank screen: an unexpected error still shows where to go next. */
export function RouteError() {
  const error = useRouteError();
  // A page of an older version, removed by an update in another tab: reload onto the new one.
  const [reloading] = useState(() => shouldReloadForStaleChunk(error));
  useEffect(() => {
    if (reloading) reloadForStaleChunk();
  }, [reloading]);
  if (reloading)
    return (
      <main className="mx-auto max-w-xl px-4 py-12" role="status">
        <p>Equipot was updated: opening the new version…</p>
      </main>
    );
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : messageOf(error);
  return (
    <main className="mx-auto max-w-xl px-4 py-12">
      <h1 className="text-3xl font-semibold">Something went wrong</h1>
      <p className="mt-3">{message}</p>
      <p className="mt-3 text-muted">Nothing you saved is lost. Reload the page to go on.</p>
      <a
        href="/"
        className="mt-6 inline-flex min-h-touch items-center rounded-lg border-2 border-ink px-5 font-semibold no-underline"
      >
        Reload Equipot
      </a>
    </main>
  );
}
