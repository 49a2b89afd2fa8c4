"use client";

import { useQuery } from "@tanstack/react-query";
import type { HabitatGroupRow } from "@/lib/queries/habitat-groups";
import { api, queryKeys } from "./api";

export function useHabitatGroups() {
  return useQuery({ queryKey: queryKeys.habitats, queryFn: async () => (await api<{ habitatGroups: HabitatGroupRow[] }>("/api/network/habitats")).habitatGroups });
}
