// Placeholder until the report page lands.
export function ReportRoute() {
  return <p>…</p>;
}
