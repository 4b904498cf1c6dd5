import { HeightsNote } from "../components/safety-note";

export function AppFooter() {
  return (
    <footer className="border-t border-line">
      <div className="mx-auto max-w-page px-4 py-4 md:px-6">
        <HeightsNote />
      </div>
    </footer>
  );
}
