// No imports: the sign-in form's schema (client code) uses the length limit too.

/** Longer return paths are dropped: no page of ours needs one, and they only carry payloads. */
export const MAX_RETURN_PATH_LENGTH = 2000;

/**
 * The page to go back to after sign-in, or null for "the role's own home".
 *
 * Browsers read a path with the WHATWG URL parser, which treats `\` as `/` in http(s) URLs and
 * drops tabs and newlines, so `/\evil.example` and `/\t/evil.example` both name another site. So
 * the path is resolved with that same parser against the app's own origin and kept only when the
 * origin is unchanged; what is kept is the parsed path, query and fragment, never the raw text.
 * `appUrl` is the app's own address (`env().APP_URL`).
 */
export function safeReturnPath(from: unknown, appUrl: string): string | null {
  if (typeof from !== "string" || from.length === 0 || from.length > MAX_RETURN_PATH_LENGTH) return null;
  const origin = new URL(appUrl).origin;
  let url: URL;
  try {
    url = new URL(from, origin);
  } catch {
    return null;
  }
  if (url.origin !== origin) return null;
  const path = `${url.pathname}${url.search}${url.hash}`;
  if (path === "/" || path.length > MAX_RETURN_PATH_LENGTH) return null;
  // Dot segments can leave a path starting with "//" (`/.//evil` becomes `//evil`), which a browser
  // would read as another host: the kept path must itself resolve to our origin.
  if (new URL(path, origin).origin !== origin) return null;
  return path;
}
