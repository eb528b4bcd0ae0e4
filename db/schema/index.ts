export * from "./people";
export * from "./catalogue";
export * from "./teaching";
export * from "./billing";
export * from "./system";
export * from "./listening";
