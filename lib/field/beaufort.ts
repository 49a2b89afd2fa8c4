// The Beaufort wind force scale with its standard descriptions (as used by the WMO and
// national weather services) and the land signs recorders use to judge it (common practice).
export const beaufortScale = [
  { force: 0, name: "Calm", sign: "smoke rises straight up" },
  { force: 1, name: "Light air", sign: "smoke drifts" },
  { force: 2, name: "Light breeze", sign: "leaves rustle, wind felt on face" },
  { force: 3, name: "Gentle breeze", sign: "leaves and twigs move" },
  { force: 4, name: "Moderate breeze", sign: "small branches move, dust lifts" },
  { force: 5, name: "Fresh breeze", sign: "small trees sway" },
  { force: 6, name: "Strong breeze", sign: "large branches move" },
  { force: 7, name: "Near gale", sign: "whole trees move" },
  { force: 8, name: "Gale", sign: "twigs break off" },
  { force: 9, name: "Strong gale", sign: "slight structural damage" },
  { force: 10, name: "Storm", sign: "trees uprooted" },
  { force: 11, name: "Violent storm", sign: "widespread damage" },
  { force: 12, name: "Hurricane force", sign: "devastation" },
] as const;
