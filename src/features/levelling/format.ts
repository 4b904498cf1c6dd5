// Field-book figures: staff readings to 0.1 mm, distances to 0.1 m, signed height differences.
const minus = (text: string) => text.replace("-", "−");

/** "1.5234" */
export const formatReadingM = (m: number) => m.toFixed(4);

/** "30.0" */
export const formatDistanceM = (m: number) => m.toFixed(1);

/** "+0.3666" or "−0.4445" */
export const formatSignedM = (m: number) => {
  const rounded = Math.round(m * 1e4) / 1e4;
  return rounded > 0 ? `+${rounded.toFixed(4)}` : minus((rounded === 0 ? 0 : rounded).toFixed(4));
};

/** "+1.0" or "−12.0" */
export const formatSignedDistanceM = (m: number) => {
  const rounded = Math.round(m * 10) / 10;
  return rounded > 0 ? `+${rounded.toFixed(1)}` : minus((rounded === 0 ? 0 : rounded).toFixed(1));
};
