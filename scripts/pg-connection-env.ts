// Prints the validated DATABASE_URL as libpq's environment variables, one "NAME<TAB>value" line
// each, for the backup scripts: pg_dump, pg_restore and psql then find the password in their
// environment, not on a command line that `ps` shows to every user of the machine.
import "./load-env";
import { libpqEnvironment } from "./libpq-env";
import { CONFIG_EXIT_CODE, requireEnv } from "./require-env";

for (const [name, value] of Object.entries(libpqEnvironment(requireEnv().DATABASE_URL))) {
  if (/[\t\n\r]/.test(value)) {
    console.error(`[turnstone] DATABASE_URL: its ${name} part holds a tab or line break`);
    process.exit(CONFIG_EXIT_CODE);
  }
  console.log(`${name}\t${value}`);
}
