import type { Rain } from "@/lib/sync/protocol";
import type { skyValues } from "@/lib/sync/protocol";

// The words for a walk's sky and rain, validator-free so the phone's recording screen can use them.

export const skyLabel: Record<(typeof skyValues)[number], string> = {
  clear: "Clear, full sun",
  mostly_sunny: "Mostly sunny",
  broken_cloud: "Sun and cloud",
  mostly_cloudy: "Mostly cloudy",
  overcast: "Overcast",
};

export const rainLabel: Record<Rain, string> = {
  none: "No rain",
  light: "Light rain",
  heavy: "Heavy rain",
};
