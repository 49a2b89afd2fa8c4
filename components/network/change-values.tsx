/** The fields a change touched, old value beside new; unchanged fields are left out. */
export function ChangeValues({ before, after }: { before: unknown; after: unknown }) {
  const b = (before && typeof before === "object" ? before : {}) as Record<string, unknown>;
  const a = (after && typeof after === "object" ? after : {}) as Record<string, unknown>;
  const keys = [...new Set([...Object.keys(b), ...Object.keys(a)])].filter((k) => JSON.stringify(b[k]) !== JSON.stringify(a[k]));
  if (keys.length === 0) return null;
  const show = (v: unknown) => (v === undefined || v === null ? "—" : typeof v === "string" ? v : JSON.stringify(v));
  return (
    <dl className="mt-1 grid grid-cols-[auto_1fr] gap-x-3 text-sm">
      {keys.map((k) => (
        <div key={k} className="contents">
          <dt className="font-bold text-shingle-700">{k}</dt>
          <dd className="break-all">
            {k in b && <del className="text-rust-700">{show(b[k])}</del>} {k in a && <ins className="text-tideline-800 no-underline">{show(a[k])}</ins>}
          </dd>
        </div>
      ))}
    </dl>
  );
}
