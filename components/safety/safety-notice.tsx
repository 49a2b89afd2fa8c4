/**
 * The usual cautions for walking a survey route (common practice in volunteer recording).
 * They do not replace local law, the landowner's rules or a licensed ecologist's advice.
 * `short` is written out rather than cut from `text`, so the compact notice keeps what matters.
 */
export const safetyPoints: { title: string; short: string; text: string }[] = [
  {
    title: "Working alone",
    short: "Tell someone your route and when you will be back, and what to do if you do not check in.",
    text: "Many walks are done alone. Before you set off, tell someone your route and the time you expect to be back, and check in with them when you return. Agree what they will do if you have not checked in by then: try to reach you, and if they cannot, call the emergency services and give them your route. Carry a charged phone; signal may be poor, so do not rely on it.",
  },
  {
    title: "Weather and heat",
    short: "Check the forecast; in heat take water, a hat and sun cream, and rest in shade.",
    text: "Check the forecast. Do not walk in thunderstorms, gales or poor visibility. In hot weather take water, a hat and sun cream, walk in the cooler part of the day and rest in shade; stop if you feel dizzy or sick. In cold weather dress in layers.",
  },
  {
    title: "Tides and coasts",
    short: "Read the tide tables; keep off soft mud and back from cliff edges.",
    text: "On coastal routes read the tide tables before you go and know where the tide can cut you off. Keep off soft mud and stay well back from cliff edges.",
  },
  {
    title: "Ticks",
    short: "Cover your legs in long grass and check yourself for ticks afterwards.",
    text: "Wear long trousers tucked into socks in long grass and bracken, check yourself for ticks afterwards and remove them promptly with a tick tool. See a doctor if a rash or fever follows.",
  },
  {
    title: "Access",
    short: "Stay where you have a right or permission to walk; keep clear of livestock.",
    text: "Stay on public rights of way or where the landowner has given permission. Leave gates as you find them and keep clear of livestock, especially cows with calves.",
  },
  {
    title: "Protected species",
    short: "Record by sight; do not handle or disturb protected species without a licence.",
    text: "Record by sight. Do not handle, catch or disturb protected species or their nests and roosts unless you hold the licence that the law requires.",
  },
];

export const safetyDeference =
  "These are general cautions, not legal advice. Local law, the landowner's rules and licensed practice where you survey come first: where they say more or differ, follow them. If in doubt, do not go.";

export function SafetyNotice({ compact = false }: { compact?: boolean }) {
  return (
    <section aria-labelledby="safety-heading" className="rounded-xl border-2 border-sand-300 bg-sand-100 p-4 text-shingle-900" data-testid="safety-notice">
      <h2 id="safety-heading" className="text-lg font-bold text-sand-800">Fieldwork safety</h2>
      <ul className={compact ? "mt-2 list-disc space-y-1 pl-5" : "mt-3 space-y-3"}>
        {safetyPoints.map((p) => (
          <li key={p.title}>
            <strong>{p.title}.</strong> {compact ? p.short : p.text}
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm">{safetyDeference}</p>
      {compact && (
        <a href="/safety" className="mt-2 inline-flex min-h-tap min-w-tap items-center font-bold text-tideline-700">
          Read the full safety notice
        </a>
      )}
    </section>
  );
}
