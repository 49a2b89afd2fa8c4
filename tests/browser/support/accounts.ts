import { demoPassword, demoPeople } from "@/db/seed/network";
import type { Role } from "@/lib/auth/roles";

export const password = demoPassword;

export const accounts: Record<Role, { email: string; name: string; home: string; heading: RegExp }> = {
  volunteer: { ...demoPeople.volunteers[0]!, home: "/field", heading: /Hello, Sam/ },
  coordinator: { ...demoPeople.coordinator, home: "/review", heading: /Sightings to review/ },
  organiser: { ...demoPeople.organiser, home: "/network", heading: /Harrowmere Valley Butterfly Transects/ },
  partner: { ...demoPeople.partner, home: "/data", heading: /Network data/ },
};
