import { photoUploadRequest } from "@/lib/photos/contract";
import { requestUploadTicket } from "@/lib/photos/tickets";
import { route } from "@/lib/http/route";

// Step 1 of the photo upload flow (see lib/photos/contract.ts): a presigned PUT for the phone.
export const POST = route({ roles: ["volunteer"], body: photoUploadRequest }, async ({ actor, body }) => requestUploadTicket(actor, body));
