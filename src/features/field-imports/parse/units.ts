// Unit conversions for logger values. Inside Equipot temperatures are °C and shock peaks are g.

/** Standard acceleration of gravity, 9.80665 m/s² exactly: the conventional value (3rd CGPM, 1901). */
export const STANDARD_GRAVITY_M_S2 = 9.80665;

export const temperatureUnits = ["degC", "degF"] as const;
export type TemperatureUnit = (typeof temperatureUnits)[number];
export const temperatureUnitLabels: Record<TemperatureUnit, string> = { degC: "°C", degF: "°F" };

export const accelerationUnits = ["g", "m/s2"] as const;
export type AccelerationUnit = (typeof accelerationUnits)[number];
export const accelerationUnitLabels: Record<AccelerationUnit, string> = { g: "g", "m/s2": "m/s²" };

export function toCelsius(value: number, unit: TemperatureUnit): number {
  return unit === "degF" ? ((value - 32) * 5) / 9 : value;
}

export function toG(value: number, unit: AccelerationUnit): number {
  return unit === "m/s2" ? value / STANDARD_GRAVITY_M_S2 : value;
}
