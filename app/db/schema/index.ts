export * from "./columns";
export * from "./array";
export * from "./users";
export * from "../relations";
