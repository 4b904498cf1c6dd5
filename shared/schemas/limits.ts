// Limits in one place, used by zod schemas on both sides of the wire.
export const limits = {
  emailMax: 254,
  passwordMin: 10,
  passwordMax: 200,
  nameMax: 120,
  notesMax: 2000,
  campaignNameMax: 120,
  latitudeDeg: { min: -90, max: 90 },
  longitudeDeg: { min: -180, max: 180 },
  // Dead Sea shore to the highest summits, with margin.
  siteHeightM: { min: -500, max: 9000 },
  jsonBodyBytes: 1_000_000,
} as const;
