// `npm run bench`: every benchmark, bounded in time, loopback only. Prints one table and writes
// bench/results.json with the machine it ran on. Figures are medians; ratios are against baselines
// measured in the same run.
import { writeFileSync } from "node:fs";
import { cpus, loadavg, totalmem } from "node:os";
import { printApiLoadRows, runApiLoadBench } from "./api-load";
import { printClientRows, runClientBench } from "./client";
import { printScienceRows, runScienceBench } from "./science";
import { printSeriesStorageRows, runSeriesStorageBench } from "./series-storage";
import { printSyncRows, runSyncBench } from "./sync";

const machine = {
  cpu: cpus()[0]?.model ?? "unknown",
  cores: cpus().length,
  memoryGiB: Math.round(totalmem() / 2 ** 30),
  node: process.version,
  at: new Date().toISOString(),
  // Other work on the machine slows the figures; the 1-minute load average at the start says how much.
  loadAverage: loadavg()[0],
};

const science = await runScienceBench();
printScienceRows(science);
const sync = await runSyncBench();
printSyncRows(sync);
const apiLoad = await runApiLoadBench();
printApiLoadRows(apiLoad);
const seriesStorage = await runSeriesStorageBench();
printSeriesStorageRows(seriesStorage);
const client = await runClientBench();
printClientRows(client);
writeFileSync(
  "bench/results.json",
  JSON.stringify({ machine, science, sync, apiLoad, seriesStorage, client }, null, 2),
);
console.log(
  `\nMachine: ${machine.cpu}, ${machine.cores} cores, ${machine.memoryGiB} GiB, Node ${machine.node}`,
);
console.log("Results written to bench/results.json");
