// Runs in the browser before any page code (Next's instrumentation-client convention). Zod 4
// probes whether it may compile its parsers with `new Function`; the pages' policy allows no eval
// (lib/http/security-headers.ts), and the browser reports even a caught probe as a violation, so
// zod is told not to try (`jitless`, zod's own setting). Only zod's small config module is loaded
// here, not the validator: the field pages' bundle stays free of it.
import { config } from "zod/v4/core";

config({ jitless: true });
