// Network-wide summary (Legendre 2019, section 2.4): mean losses, gains and D over the
// compared sites, and the shares of D due to losses and to gains.
import { directionOf } from "./indices";
import type { ChangeSummary, SiteChange } from "./types";

export function summarise(sites: readonly SiteChange[]): ChangeSummary {
  const n = sites.length;
  if (n === 0) {
    return { meanLosses: null, meanGains: null, meanDissimilarity: null, lossShare: null, gainShare: null, direction: null };
  }
  const mean = (f: (s: SiteChange) => number) => sites.reduce((a, s) => a + f(s), 0) / n;
  const meanLosses = mean((s) => s.losses);
  const meanGains = mean((s) => s.gains);
  const meanDissimilarity = mean((s) => s.dissimilarity);
  // Shares are undefined when nothing changed anywhere (mean D = 0).
  const shares = meanDissimilarity > 0;
  return {
    meanLosses,
    meanGains,
    meanDissimilarity,
    lossShare: shares ? meanLosses / meanDissimilarity : null,
    gainShare: shares ? meanGains / meanDissimilarity : null,
    direction: directionOf(meanLosses, meanGains),
  };
}
