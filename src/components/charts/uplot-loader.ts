// Loaded on demand by each chart, so uPlot and its styles stay out of the first download.
import uPlot from "uplot";
import "uplot/dist/uPlot.min.css";

export default uPlot;
