// The configuration check `npm start` and `npm test` run before anything else: lib/env.ts's one
// message naming every wrong variable, and exit 78, when the environment will not do.
import "./load-env";
import { requireEnv } from "./require-env";

requireEnv();
