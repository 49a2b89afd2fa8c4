import { route } from "@/lib/http/route";
import { myRecords } from "@/lib/queries/records";

// `asOf` (taken before reading) lets the phone say how old its saved copy is when it shows it offline.
export const GET = route({ roles: ["volunteer"] }, async ({ actor }) => {
  const asOf = new Date().toISOString();
  return { visits: await myRecords(actor), asOf };
});
