// The transect and habitat pages' query keys; the calls themselves are the organiser pages' shared client.
export { api, ApiError, messagesUnder } from "@/components/network/api";

export const queryKeys = {
  transects: ["network", "transects"] as const,
  transect: (id: string) => ["network", "transects", id] as const,
  habitats: ["network", "habitat-groups"] as const,
};
