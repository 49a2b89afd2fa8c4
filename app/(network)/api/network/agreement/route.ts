import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { agreementVersions, publishAgreement } from "@/lib/queries/agreements";
import { agreementSchema } from "../../../network/agreement/schema";

export const GET = route({ roles: ["organiser"] }, async () => ({ versions: await agreementVersions() }));

/** Publishes a new version; every volunteer is asked to accept it at their next visit to the field pages. */
export const POST = route({ roles: ["organiser"], body: agreementSchema }, async ({ actor, body }) =>
  NextResponse.json(await publishAgreement(actor, body), { status: 201 }),
);
