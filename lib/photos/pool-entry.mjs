// Plain-JavaScript entry of the photo pool's threads. piscina loads it by its path at run time,
// so Next never bundles it; it registers tsx's loader in the thread, so that the TypeScript task
// loads the same way under vitest, tsx and the built server.
import { register } from "tsx/esm/api";

register();
const { default: judgePhoto } = await import("./pool-task.ts");
export default judgePhoto;
