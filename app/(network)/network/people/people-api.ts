// The People pages' data: react-query keys and the answers of /api/network/people/**.
import type { PersonDetail, PersonRow } from "@/lib/queries/people";

export type PeopleList = {
  people: (Omit<PersonRow, "lastSignInAt"> & { lastSignInAt: string | null })[];
  invitations: { id: string; name: string; email: string; roles: PersonRow["roles"]; expiresAt: string }[];
};
export type PersonAnswer = PersonDetail;

export const peopleKeys = {
  all: ["network", "people"] as const,
  list: ["network", "people", "list"] as const,
  person: (id: string) => ["network", "people", id] as const,
};

export { ApiError, api } from "../transects/api";
