export * from "./people";
export * from "./catalogue";
export * from "./bench";
export * from "./reports";
export * from "./editorial";
export * from "./community";
