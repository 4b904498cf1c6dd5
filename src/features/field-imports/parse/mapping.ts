// Equipot's column mapping for logger CSV files: which column holds the time and which the values,
// how times and numbers are written and in which unit. Guessed from the header, changed by the user,
// remembered per logger model (validated with this schema when read back).
import { z } from "zod";
import { accelerationUnits, temperatureUnits } from "./units";

export const importKinds = ["temperatures", "shock-log"] as const;
export const importKind = z.enum(importKinds);
export type ImportKind = z.infer<typeof importKind>;

export const timeFormats = ["iso", "local", "unix-s"] as const;
export type TimeFormat = (typeof timeFormats)[number];
export const timeFormatLabels: Record<TimeFormat, string> = {
  iso: "ISO 8601 with offset",
  local: "Date and time, logger's clock",
  "unix-s": "Unix time in seconds",
};

/** What each format looks like, for the hint under the choice (all the same instant). */
export const timeFormatExamples: Record<TimeFormat, string> = {
  iso: "2026-06-03T14:05:00+02:00 or 2026-06-03T12:05:00Z",
  local: "2026-06-03 14:05:00, read with the UTC offset chosen below",
  "unix-s": "1780488300 (seconds since 1970-01-01 UTC)",
};

export const delimiters = [",", ";", "\t"] as const;
export type Delimiter = (typeof delimiters)[number];
export const delimiterLabels: Record<Delimiter, string> = {
  ",": "Comma ( , )",
  ";": "Semicolon ( ; )",
  "\t": "Tab",
};

const column = z.string().trim().min(1, "Choose a column");
const optionalColumn = column.nullable();

const temperatureColumns = z.strictObject({
  kind: z.literal("temperatures"),
  temperature: column,
  humidity: optionalColumn,
  temperatureUnit: z.enum(temperatureUnits),
});

const shockColumns = z
  .strictObject({
    kind: z.literal("shock-log"),
    x: optionalColumn,
    y: optionalColumn,
    z: optionalColumn,
    duration: optionalColumn,
    accelerationUnit: z.enum(accelerationUnits),
  })
  .refine((c) => c.x !== null || c.y !== null || c.z !== null, {
    message: "Choose the column of at least one axis",
    path: ["x"],
  });

export const columnMapping = z
  .strictObject({
    /** Line of the header (1 for the first line); loggers may write a preamble above it. */
    headerLine: z.number().int().min(1, "Header line must be 1 or more").max(100),
    delimiter: z.enum(delimiters),
    decimalSeparator: z.enum([".", ","]),
    time: z.strictObject({
      column,
      format: z.enum(timeFormats),
      /** For "local" times only: minutes east of UTC (e.g. 120 for UTC+02:00). */
      utcOffsetMinutes: z
        .number()
        .int()
        .min(-14 * 60, "UTC offset must be between −14:00 and +14:00")
        .max(14 * 60, "UTC offset must be between −14:00 and +14:00"),
    }),
    values: z.discriminatedUnion("kind", [temperatureColumns, shockColumns]),
  })
  .refine((m) => !(m.delimiter === "," && m.decimalSeparator === ","), {
    message: "A decimal comma needs a delimiter other than the comma",
    path: ["decimalSeparator"],
  });
export type ColumnMapping = z.infer<typeof columnMapping>;
export type TemperatureColumns = z.infer<typeof temperatureColumns>;
export type ShockColumns = z.infer<typeof shockColumns>;

/** The columns a mapping reads, each with what it is for (to check them against the header). */
export function mappedColumns(mapping: ColumnMapping): { role: string; name: string }[] {
  const v = mapping.values;
  const all: [string, string | null][] =
    v.kind === "temperatures"
      ? [
          ["temperature", v.temperature],
          ["humidity", v.humidity],
        ]
      : [
          ["peak x", v.x],
          ["peak y", v.y],
          ["peak z", v.z],
          ["duration", v.duration],
        ];
  return [["time", mapping.time.column] as [string, string | null], ...all]
    .filter((entry): entry is [string, string] => entry[1] !== null)
    .map(([role, name]) => ({ role, name }));
}
