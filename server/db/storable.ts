// Text as PostgreSQL can keep it. A text parameter reaches PostgreSQL as UTF-8, a lone surrogate
// turned into U+FFFD; inside JSON it would stay an escape that PostgreSQL refuses, and NUL is
// refused in text and jsonb alike.
export const wellFormedText = (value: string) =>
  Buffer.from(value, "utf8").toString("utf8").replaceAll("\u0000", "\uFFFD");

/** A JSON.stringify replacer encoding every string the way a parameter would be. */
export const wellFormed = (_key: string, value: unknown) =>
  typeof value === "string" ? wellFormedText(value) : value;

/** Any value made safe for a jsonb column, e.g. a refused mutation kept whole for recovery. */
export const storableJson = (value: unknown): unknown =>
  value === undefined ? null : (JSON.parse(JSON.stringify(value, wellFormed)) as unknown);
