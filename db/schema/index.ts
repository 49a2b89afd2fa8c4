export * from "./people";
export * from "./taxa";
export * from "./sites";
export * from "./field";
export * from "./review";
export * from "./analysis";
export * from "./comms";
export * from "./history";
