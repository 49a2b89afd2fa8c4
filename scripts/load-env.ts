// Scripts run outside Next, which would otherwise load .env for us.
import { existsSync } from "node:fs";
import path from "node:path";

const file = path.resolve(import.meta.dirname, "..", ".env");
if (existsSync(file)) process.loadEnvFile(file);
