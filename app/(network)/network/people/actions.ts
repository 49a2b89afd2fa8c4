"use server";

import { revalidatePath } from "next/cache";
import { action } from "@/lib/http/action";
import { invitePerson, updatePerson } from "@/lib/queries/people";
import { inviteSchema, updatePersonSchema } from "./schema";

export const inviteAction = action({ roles: ["organiser"], schema: inviteSchema }, async (input, actor) => {
  await invitePerson(actor, input);
  revalidatePath("/network/people");
  return { email: input.email };
});

export const updatePersonAction = action({ roles: ["organiser"], schema: updatePersonSchema }, async (input, actor) => {
  const result = await updatePerson(actor, input);
  revalidatePath("/network/people");
  return result;
});
