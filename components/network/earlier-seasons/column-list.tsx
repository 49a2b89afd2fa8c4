/** A file's columns with what each holds; the required ones say so. */
export function ColumnList<C extends string>({ columns, required, help }: { columns: readonly C[]; required: readonly C[]; help: Record<C, string> }) {
  return (
    <dl className="mt-2 grid gap-x-3 gap-y-1 sm:grid-cols-[auto_1fr]">
      {columns.map((c) => (
        <div key={c} className="contents">
          <dt className="font-mono text-sm font-bold">{c}{required.includes(c) ? "" : " (optional)"}</dt>
          <dd>{help[c]}</dd>
        </div>
      ))}
    </dl>
  );
}
