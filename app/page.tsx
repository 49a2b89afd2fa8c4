import { redirect } from "next/navigation";
import { currentActor } from "@/lib/auth/guard";
import { homeFor } from "@/lib/auth/roles";

export default async function Home() {
  const actor = await currentActor();
  redirect(actor ? homeFor(actor.roles) : "/sign-in");
}
