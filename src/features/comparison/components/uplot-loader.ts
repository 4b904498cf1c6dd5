// Loaded on demand by the charts, so uPlot and its styles stay out of the first download.
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

export default uPlot;
