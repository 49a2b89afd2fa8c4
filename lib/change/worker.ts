// Permutation worker thread: receives ranges, answers with their counts (see threaded.ts).
import { parentPort, threadId, workerData } from "node:worker_threads";
import { runPermutationChunk } from "./permutation";
import type { WorkerData, WorkerReply, WorkerTask } from "./threaded";

const data = workerData as WorkerData;
const port = parentPort;
if (port === null) throw new Error("worker.ts must run as a worker thread");

port.on("message", (task: WorkerTask) => {
  if (task.type === "stop") {
    port.close();
    return;
  }
  let reply: WorkerReply;
  try {
    const counts = runPermutationChunk({ ...data, start: task.start, count: task.count });
    reply = { type: "counts", counts, threadId };
  } catch (error) {
    reply = { type: "error", message: error instanceof Error ? error.message : String(error) };
  }
  port.postMessage(reply);
});
port.postMessage({ type: "ready" } satisfies WorkerReply);
