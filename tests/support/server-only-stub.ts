// Under vitest there is no React Server Components boundary; the real `server-only`
// package throws on import outside Next's server bundle, so tests use this no-op.
export {};
