// Item ids are made from the label once, when an item is first saved, and then kept: results
// are tied to the id, so renaming an item must not cut it off from its results.
const idMax = 40;

/** "Room temperature (°C)" → "room-temperature-c": lowercase letters, digits and dashes. */
export function slugFromLabel(label: string): string {
  const slug = label
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+/, "")
    .slice(0, idMax)
    .replace(/-+$/, "");
  return slug === "" ? "item" : slug;
}

/**
 * An id for every item: existing ones keep theirs, new ones get one from their label, made
 * unique with a number ("weather", "weather-2", …) without passing the length limit.
 */
export function assignItemIds(items: readonly { id: string | null; label: string }[]): string[] {
  const taken = new Set(items.flatMap((item) => (item.id === null ? [] : [item.id])));
  return items.map((item) => {
    if (item.id !== null) return item.id;
    const base = slugFromLabel(item.label);
    let candidate = base;
    for (let n = 2; taken.has(candidate); n += 1) {
      const suffix = `-${n}`;
      candidate = `${base.slice(0, idMax - suffix.length).replace(/-+$/, "")}${suffix}`;
    }
    taken.add(candidate);
    return candidate;
  });
}
