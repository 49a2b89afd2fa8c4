// The address of the other end of a request's TCP connection, which a client cannot choose (it
// could choose X-Forwarded-For). serve.mjs stamps it on every request under this header, after
// dropping whatever the client sent under the same name; lib/http/client-address.ts reads it.

/** The request header; lower case, as Node lists header names. */
export const PEER_ADDRESS_HEADER = "x-turnstone-peer-address";

/**
 * Replaces any client-sent PEER_ADDRESS_HEADER with the socket's remote address (removed when the
 * socket no longer has one). Node folds repeated or differently cased copies into one entry of
 * `req.headers`; `req.rawHeaders` keeps every copy, so they are dropped there too.
 * @param {import("node:http").IncomingMessage} req
 */
export function stampPeerAddress(req) {
  const address = req.socket.remoteAddress;
  const raw = [];
  for (let i = 0; i < req.rawHeaders.length; i += 2) {
    if (req.rawHeaders[i].toLowerCase() !== PEER_ADDRESS_HEADER) raw.push(req.rawHeaders[i], req.rawHeaders[i + 1]);
  }
  if (address) {
    req.headers[PEER_ADDRESS_HEADER] = address;
    raw.push(PEER_ADDRESS_HEADER, address);
  } else {
    delete req.headers[PEER_ADDRESS_HEADER];
  }
  req.rawHeaders = raw;
}

/**
 * A node:http request listener that stamps each request before `handler` sees it.
 * @param {(req: import("node:http").IncomingMessage, res: import("node:http").ServerResponse) => unknown} handler
 * @returns {(req: import("node:http").IncomingMessage, res: import("node:http").ServerResponse) => unknown}
 */
export function withPeerAddress(handler) {
  return (req, res) => {
    stampPeerAddress(req);
    return handler(req, res);
  };
}
