// Imported first by a command that needs the query layer. Its modules start with
// `import "server-only"`, which throws unless the "react-server" export condition is on (Next
// turns it on for server code). Started without it, the command runs itself again with it (same
// Node flags and arguments) and exits with that run's status, before its other modules run.
import { spawnSync } from "node:child_process";

if (!import.meta.resolve("server-only").endsWith("/empty.js")) {
  const [script, ...args] = process.argv.slice(1);
  const run = spawnSync(process.execPath, [...process.execArgv, "--conditions=react-server", script!, ...args], { stdio: "inherit" });
  process.exit(run.status ?? 1);
}
