// Placeholder until the review pages land.
export function ReviewRoute() {
  return <p>…</p>;
}
export function ReviewRecordRoute() {
  return <p>…</p>;
}
