import { once } from "node:events";
import http from "node:http";
import net from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { PEER_ADDRESS_HEADER, withPeerAddress } from "@/scripts/peer-address.mjs";

// scripts/serve.mjs wraps Next's request handler in withPeerAddress: whatever a client sends as
// x-turnstone-peer-address, the handler sees the address at the other end of the TCP connection.
let server: http.Server;
let port: number;
let seen: { header: string | string[] | undefined; raw: string[] }[] = [];

beforeAll(async () => {
  server = http.createServer(
    withPeerAddress((req, res) => {
      seen.push({ header: req.headers[PEER_ADDRESS_HEADER], raw: req.rawHeaders });
      res.end("ok");
    }),
  );
  server.listen(0, "127.0.0.1");
  await once(server, "listening");
  port = (server.address() as net.AddressInfo).port;
});

afterAll(() => server.close());

/** Sends a request exactly as written (fetch would normalise the headers), and waits for the answer. */
async function rawRequest(headerLines: string[]) {
  const socket = net.connect(port, "127.0.0.1");
  await once(socket, "connect");
  socket.end(["GET / HTTP/1.1", `Host: 127.0.0.1:${port}`, "Connection: close", ...headerLines, "", ""].join("\r\n"));
  let answer = "";
  socket.on("data", (d) => (answer += d));
  await once(socket, "close");
  return answer;
}

describe("the peer address header", () => {
  it("is the connection's address whatever the client sent under that name", async () => {
    seen = [];
    const answer = await rawRequest(["X-Turnstone-Peer-Address: 203.0.113.9", "x-turnstone-peer-address: 198.51.100.4", "X-Forwarded-For: 192.0.2.1"]);
    expect(answer).toMatch(/^HTTP\/1\.1 200/);
    expect(seen).toHaveLength(1);
    expect(seen[0]!.header).toBe("127.0.0.1");
    const rawValues = seen[0]!.raw.filter((_, i, all) => i % 2 === 1 && all[i - 1]!.toLowerCase() === PEER_ADDRESS_HEADER);
    expect(rawValues).toEqual(["127.0.0.1"]);
    // Other headers pass untouched.
    expect(seen[0]!.raw).toContain("X-Forwarded-For");
  });

  it("is there when the client sent none", async () => {
    seen = [];
    await rawRequest([]);
    expect(seen[0]!.header).toBe("127.0.0.1");
  });
});
