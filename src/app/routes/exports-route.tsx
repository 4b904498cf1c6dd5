// Placeholder until the exports page lands.
export function ExportsRoute() {
  return <p>…</p>;
}
