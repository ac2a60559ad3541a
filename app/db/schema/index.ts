export * from "../relations";
export * from "./array";
export * from "./auth";
export * from "./columns";
export * from "./committee";
export * from "./mail";
export * from "./proposals";
export * from "./users";
