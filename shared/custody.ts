// The chain of custody's rule, the same on the tablet (refused at once) and on the server: a
// handover comes after the crate's last one, and is given by the person who received it then.

export type CustodyProblem =
  | { field: "at"; kind: "out-of-order" }
  | { field: "fromName"; kind: "wrong-giver"; holder: string };

/** Names match when they differ only by spaces at the ends or by case. */
const sameName = (a: string, b: string) => a.trim().toLowerCase() === b.trim().toLowerCase();

export function custodyProblem(
  last: { at: string | Date; toName: string } | null,
  next: { at: string | Date; fromName: string },
): CustodyProblem | null {
  if (last === null) return null;
  if (new Date(next.at).getTime() <= new Date(last.at).getTime())
    return { field: "at", kind: "out-of-order" };
  if (!sameName(last.toName, next.fromName))
    return { field: "fromName", kind: "wrong-giver", holder: last.toName.trim() };
  return null;
}
