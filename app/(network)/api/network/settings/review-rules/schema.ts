import { z } from "zod";
import { walkRulesSchema } from "@/lib/review/walk-rules";
import { warningRulesSchema } from "@/lib/review/warning-rules";

// PUT /api/network/settings/review-rules and the settings page's form check the same schemas
// (lib/review/*-rules.ts), so whatever the form lets through the server takes, and the reverse.
export const reviewRulesSchema = z.object({ walkRules: walkRulesSchema, warningRules: warningRulesSchema });
export type ReviewRulesInput = z.input<typeof reviewRulesSchema>;
export type ReviewRulesValues = z.output<typeof reviewRulesSchema>;
