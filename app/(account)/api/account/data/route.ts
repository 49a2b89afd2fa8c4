import { NextResponse } from "next/server";
import { roles } from "@/lib/auth/roles";
import { route } from "@/lib/http/route";
import { personalData } from "@/lib/queries/personal-data";

/** The signed-in person's own data as a JSON file (GDPR Art. 15 and 20: a copy, in a machine-readable format). */
export const GET = route({ roles }, async ({ actor }) => {
  const data = await personalData(actor.id);
  return new NextResponse(JSON.stringify(data, null, 2), {
    headers: {
      "content-type": "application/json; charset=utf-8",
      "content-disposition": `attachment; filename="turnstone-my-data-${data.exportedAt.slice(0, 10)}.json"`,
      "cache-control": "no-store",
    },
  });
});
