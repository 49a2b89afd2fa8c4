import { NextResponse } from "next/server";
import { route } from "@/lib/http/route";
import { invitePerson, listPeople, pendingInvitations } from "@/lib/queries/people";
import { inviteSchema } from "../../../network/people/schema";

export const GET = route({ roles: ["organiser"] }, async () => {
  const [people, invitations] = await Promise.all([listPeople(), pendingInvitations()]);
  return { people, invitations };
});

export const POST = route({ roles: ["organiser"], body: inviteSchema }, async ({ actor, body }) => {
  const { id } = await invitePerson(actor, body);
  return NextResponse.json({ invitation: { id, email: body.email, roles: body.roles } }, { status: 201 });
});
