// The worker thread's entry: registers tsx's loader in this thread, then runs the TypeScript source.
import { register } from "tsx/esm/api";

register();
await import("./preview.thread.ts");
