// PostgreSQL text cannot hold the NUL character: refuse it at the edge, naming the field, so that
// it never reaches the database as a server error (which would block a tablet's queue).
export const hasNul = (value: string) => value.includes("\u0000");
export const nulMessage = (field: string) =>
  `${field} contains a NUL character, which cannot be stored`;
