import { NextResponse } from "next/server";
import { photoViewUrl } from "@/lib/photos/links";
import { parsePhotoId, photoViewQuery } from "@/lib/photos/params";
import { route } from "@/lib/http/route";

// Step 4 of the photo flow: a redirect to a signed URL that lasts five minutes. The redirect
// itself must not be cached longer than the URL it points to.
export const GET = route<undefined, typeof photoViewQuery, { id: string }>(
  { roles: ["volunteer", "coordinator", "organiser"], query: photoViewQuery },
  async ({ actor, query, params }) => {
    const url = await photoViewUrl(actor, parsePhotoId(params.id), query.size);
    return new NextResponse(null, { status: 302, headers: { Location: url, "Cache-Control": "private, no-store" } });
  },
);
