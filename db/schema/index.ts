export * from "./users";
export * from "./audit";
export * from "./uploads";
export * from "./sellers";
export * from "./listings";
export * from "./moderation";
export * from "./mail";
export * from "./orders";
