"use server";

import { action } from "@/lib/http/action";
import { acceptAgreement } from "@/lib/queries/agreements";
import { acceptanceSchema } from "./schema";

export const acceptAgreementAction = action({ roles: ["volunteer"], schema: acceptanceSchema }, (input, actor) => acceptAgreement(actor, input));
