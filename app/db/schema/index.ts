export * from "../relations";
export * from "./array";
export * from "./auth";
export * from "./columns";
export * from "./mail";
export * from "./nights";
export * from "./proposals";
export * from "./users";
