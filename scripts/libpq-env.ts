/** URL query parameters libpq also reads from its environment (the ones a managed server needs). */
const queryParameters: Record<string, string> = {
  sslmode: "PGSSLMODE",
  sslrootcert: "PGSSLROOTCERT",
  sslcert: "PGSSLCERT",
  sslkey: "PGSSLKEY",
  application_name: "PGAPPNAME",
  connect_timeout: "PGCONNECT_TIMEOUT",
};

/** A postgres:// URL as libpq's environment variables (PostgreSQL docs, "Environment Variables"). */
export function libpqEnvironment(databaseUrl: string): Record<string, string> {
  const url = new URL(databaseUrl);
  const vars: Record<string, string> = {
    PGHOST: decodeURIComponent(url.hostname.replace(/^\[|\]$/g, "")),
    PGPORT: url.port || "5432",
    PGUSER: decodeURIComponent(url.username),
    PGPASSWORD: decodeURIComponent(url.password),
    PGDATABASE: decodeURIComponent(url.pathname.replace(/^\//, "")),
  };
  for (const [name, value] of url.searchParams) {
    const variable = queryParameters[name];
    if (variable) vars[variable] = value;
  }
  return Object.fromEntries(Object.entries(vars).filter(([, v]) => v !== ""));
}
