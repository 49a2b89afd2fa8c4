// Plain-JavaScript entry of a permutation worker thread: registers tsx's loader in this
// thread so the TypeScript worker loads the same way under tsx, vitest or plain node.
import { register } from "tsx/esm/api";

register();
await import("./worker.ts");
