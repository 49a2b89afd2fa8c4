import type { Metadata } from "next";
import { headers } from "next/headers";
import { LogoMark } from "@/components/brand/logo-mark";
import { rolesInWords } from "@/lib/auth/roles";
import { isAppError } from "@/lib/errors";
import { clientAddress } from "@/lib/http/client-address";
import { findOpenInvitation } from "@/lib/queries/people";
import { AcceptForm } from "./accept-form";
import { acceptSchema } from "./schema";

export const metadata: Metadata = { title: "Accept invitation" };

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const found = await lookUp(token);
  const invite = "invite" in found ? found.invite : null;
  return (
    <main id="main" className="mx-auto max-w-md px-4 py-10">
      <LogoMark size={48} />
      <div className="card mt-6">
        {invite ? (
          <>
            <h1 className="mb-2 text-xl font-bold">Welcome, {invite.name}</h1>
            <p className="mb-4">You are joining as {rolesInWords(invite.roles)} with {invite.email}.</p>
            <AcceptForm token={token} />
          </>
        ) : "wait" in found ? (
          <>
            <h1 className="mb-2 text-xl font-bold">Please wait before trying again</h1>
            <p>{found.wait}</p>
          </>
        ) : (
          <>
            <h1 className="mb-2 text-xl font-bold">This invitation cannot be used</h1>
            <p>It has expired or was already used. Ask your network organiser to send a new one.</p>
          </>
        )}
      </div>
    </main>
  );
}

/** The invitation, or why there is none to show: unknown or used (null), or too many tries (the wait). */
async function lookUp(token: string): Promise<{ invite: Awaited<ReturnType<typeof findOpenInvitation>> } | { wait: string }> {
  if (!acceptSchema.shape.token.safeParse(token).success) return { invite: null }; // no token of ours looks like this
  try {
    return { invite: await findOpenInvitation(token, clientAddress(await headers())) };
  } catch (error) {
    if (isAppError(error) && error.status === 429) return { wait: error.message };
    throw error;
  }
}
