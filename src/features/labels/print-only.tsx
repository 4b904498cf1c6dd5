// While this is mounted, printing shows only elements marked data-print-only (and what is inside
// them): the app's header, tabs and sync bar stay on screen and off the paper.
export function PrintOnlyMarked() {
  return (
    <style>{`@media print {
  body * { visibility: hidden; }
  [data-print-only], [data-print-only] * { visibility: visible; }
  [data-print-only] { position: absolute; inset: 0 auto auto 0; width: 100%; }
  @page { margin: 12mm; }
}`}</style>
  );
}
