// Pages are loaded on demand (router.tsx). While one loads, the page left stays in view and a bar
// says what is happening, so a navigation never shows a blank screen.
import { useEffect, useState } from "react";
import { Outlet, useNavigation } from "react-router-dom";
import { Loading } from "../../components/loading";

/** Shown before the first page of a visit is ready (its code is still loading). */
export function FirstPageLoading() {
  return (
    <main id="main" className="mx-auto w-full max-w-xl px-4 py-12">
      <Loading label="Opening Equipot…" />
    </main>
  );
}

// A page served by the service worker opens within a few frames: no bar flashes for that.
const barDelayMs = 150;

function OpeningBar() {
  const [shown, setShown] = useState(false);
  useEffect(() => {
    const timer = setTimeout(() => setShown(true), barDelayMs);
    return () => clearTimeout(timer);
  }, []);
  if (!shown) return null;
  return (
    <div
      role="status"
      className="fixed inset-x-0 top-0 z-50 flex justify-center border-b-2 border-line bg-surface px-4 py-2 text-sm font-semibold"
    >
      Opening the page…
    </div>
  );
}

/** The root of every page: the page, and a bar while the next page's code loads. */
export function RouteShell() {
  const navigation = useNavigation();
  return (
    <>
      {navigation.state === "loading" && <OpeningBar />}
      <Outlet />
    </>
  );
}
