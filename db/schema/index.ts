export * from "./people";
export * from "./catalogue";
