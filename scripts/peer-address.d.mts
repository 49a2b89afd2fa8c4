import type { IncomingMessage, ServerResponse } from "node:http";

export declare const PEER_ADDRESS_HEADER: "x-turnstone-peer-address";
export declare function stampPeerAddress(req: IncomingMessage): void;
export declare function withPeerAddress(
  handler: (req: IncomingMessage, res: ServerResponse) => unknown,
): (req: IncomingMessage, res: ServerResponse) => unknown;
