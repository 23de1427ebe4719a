export * from "./users";
export * from "./audit";
