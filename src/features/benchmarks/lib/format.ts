// Numbers of the benchmark list: published heights in metres to the millimetre (a fourth decimal
// when given), their σ in mm; a true minus sign so columns of tabular figures line up.
const heightFormat = new Intl.NumberFormat("en-GB", {
  minimumFractionDigits: 3,
  maximumFractionDigits: 4,
  useGrouping: false,
});
const sigmaFormat = new Intl.NumberFormat("en-GB", {
  minimumFractionDigits: 1,
  maximumFractionDigits: 2,
  useGrouping: false,
});

const minus = (text: string) => text.replace("-", "−");

/** "2869.412 m" */
export const formatPublishedHeightM = (heightM: number) =>
  `${minus(heightFormat.format(heightM))} m`;

/** "4.0 mm" from metres */
export const formatSigmaMm = (sigmaM: number) => `${sigmaFormat.format(sigmaM * 1000)} mm`;
