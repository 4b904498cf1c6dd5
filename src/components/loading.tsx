import { StatusShape } from "./status-shape";

export function Loading({ label = "Loading…" }: { label?: string }) {
  return (
    <p role="status" className="flex items-center gap-3 py-6 text-muted">
      <StatusShape shape="dots" className="animate-spin motion-reduce:animate-none" />
      <span>{label}</span>
    </p>
  );
}
