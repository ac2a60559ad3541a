export * from "../relations";
export * from "./array";
export * from "./auth";
export * from "./catalogue";
export * from "./columns";
export * from "./mail";
export * from "./proposals";
export * from "./users";
