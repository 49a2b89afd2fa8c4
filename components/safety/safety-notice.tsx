/**
 * The usual cautions for walking a survey route (common practice in volunteer recording).
 * They do not replace local law, the landowner's rules or a licensed ecologist's advice.
 */
export const safetyPoints: { title: string; text: string }[] = [
  { title: "Tell someone", text: "Before you set off, tell someone your route and when you expect to be back, and check in when you return. Carry a charged phone; signal may be poor, so do not rely on it." },
  { title: "Weather and heat", text: "Check the forecast. Do not walk in thunderstorms, gales or poor visibility. In hot weather take water, a hat and sun cream; in cold weather dress in layers." },
  { title: "Tides and coasts", text: "On coastal routes read the tide tables before you go and know where the tide can cut you off. Keep off soft mud and stay well back from cliff edges." },
  { title: "Ticks", text: "Wear long trousers tucked into socks in long grass and bracken, check yourself for ticks afterwards and remove them promptly with a tick tool. See a doctor if a rash or fever follows." },
  { title: "Access", text: "Stay on public rights of way or where the landowner has given permission. Leave gates as you find them and keep clear of livestock, especially cows with calves." },
  { title: "Protected species", text: "Record by sight; do not handle, catch or disturb protected species or their nests and roosts unless you hold the licence that the law requires." },
];

export function SafetyNotice({ compact = false }: { compact?: boolean }) {
  return (
    <section aria-labelledby="safety-heading" className="rounded-xl border-2 border-sand-300 bg-sand-100 p-4 text-shingle-900">
      <h2 id="safety-heading" className="text-lg font-bold text-sand-800">Fieldwork safety</h2>
      <ul className={compact ? "mt-2 list-disc space-y-1 pl-5" : "mt-3 space-y-3"}>
        {safetyPoints.map((p) => (
          <li key={p.title}>
            <strong>{p.title}.</strong> {compact ? p.text.split(". ")[0] + "." : p.text}
          </li>
        ))}
      </ul>
      <p className="mt-3 text-sm">
        These are general cautions. Follow local law, the landowner&apos;s rules and licensed practice where you survey; if in doubt, do not go.
      </p>
    </section>
  );
}
