// Comparison series: reading uploaded files, the grid, the analysis and the height result. Pure
// (no I/O): used by the server's worker threads and by the browser's Web Worker.
export * from "./exact-ratio";
export * from "./series-time";
export * from "./series-parser";
export * from "./series-grid";
export * from "./series-reader";
export * from "./analyse-series";
export * from "./height-explain";
export * from "./height-result";
