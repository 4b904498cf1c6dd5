export * from "./limits";
export * from "./errors";
export * from "./auth";
export * from "./campaigns";
export * from "./sites";
export * from "./attachments";
export * from "./crates";
export * from "./benchmarks";
