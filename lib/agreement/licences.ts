// The licences a network may publish its records under, by SPDX identifier (spdx.org/licenses:
// CC0-1.0, CC-BY-4.0, CC-BY-NC-4.0). Dependency-free: the schema, the server and the forms read it.

export const RECORD_LICENCES = ["CC0-1.0", "CC-BY-4.0", "CC-BY-NC-4.0"] as const;
export type RecordLicence = (typeof RECORD_LICENCES)[number];

export const licenceLabel: Record<RecordLicence, string> = {
  "CC0-1.0": "CC0 1.0: no rights reserved",
  "CC-BY-4.0": "CC BY 4.0: reuse with credit",
  "CC-BY-NC-4.0": "CC BY-NC 4.0: reuse with credit, not commercially",
};

/** Where each licence's text is published (creativecommons.org). */
export const licenceUrl: Record<RecordLicence, string> = {
  "CC0-1.0": "https://creativecommons.org/publicdomain/zero/1.0/",
  "CC-BY-4.0": "https://creativecommons.org/licenses/by/4.0/",
  "CC-BY-NC-4.0": "https://creativecommons.org/licenses/by-nc/4.0/",
};
