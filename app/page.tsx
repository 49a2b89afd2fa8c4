import { redirect } from "next/navigation";
import { currentActor } from "@/lib/auth/guard";
import { roleHome } from "@/lib/auth/roles";

export default async function Home() {
  const actor = await currentActor();
  redirect(actor ? roleHome[actor.role] : "/sign-in");
}
