import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { reviewRules } from "@/lib/queries/review-rules";
import { ReviewRulesForm } from "./review-rules-form";

export const metadata: Metadata = { title: "Walk rules and warnings" };

export default async function ReviewRulesPage() {
  await requirePageActor(["organiser"], "/network/review-rules");
  const rules = await reviewRules();
  return (
    <div className="space-y-6">
      <h1 className="text-2xl font-bold text-tideline-800">Walk rules and warnings</h1>
      <p className="max-w-prose">
        The conditions the network&apos;s walks should be made in, and when reviewers are warned about a sighting. The starting walk
        rules are the published transect-walk method&apos;s rules as we remember them: between 10:45 and 15:45, at least 13 °C with at
        least 60 % sunshine or at least 17 °C in any sun, wind at most force 5, no rain. They have not been checked against the
        method&apos;s own text: compare them with the scheme your network follows before you rely on them. The warning numbers are our
        own starting choice.
      </p>
      <ReviewRulesForm rules={rules} />
    </div>
  );
}
