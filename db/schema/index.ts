export * from "./people";
export * from "./catalogue";
export * from "./bench";
export * from "./reports";
