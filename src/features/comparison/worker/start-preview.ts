// Vite bundles the worker as its own chunk from this URL; the CSP allows worker-src 'self'.
export function startPreviewWorker(): Worker {
  return new Worker(new URL("./preview.worker.ts", import.meta.url), { type: "module" });
}
