export * from "./columns";
export * from "./array";
export * from "./users";
export * from "./auth";
export * from "./mail";
export * from "./proposals";
export * from "../relations";
