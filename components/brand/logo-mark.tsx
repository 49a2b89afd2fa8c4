/** Turnstone's mark: a pebble being turned over, drawn as two offset stones and a turning arc. */
export function LogoMark({ size = 32, className }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 48 48" role="img" aria-label="Turnstone" className={className}>
      <rect width="48" height="48" rx="12" fill="#155555" />
      <ellipse cx="20" cy="29" rx="12" ry="8" fill="#f0cf7a" />
      <ellipse cx="29" cy="22" rx="9" ry="6" fill="#ebe9e3" transform="rotate(-18 29 22)" />
      <path d="M10 17 A16 16 0 0 1 34 9" fill="none" stroke="#ffffff" strokeWidth="3" strokeLinecap="round" />
      <path d="M31 5 L36 9 L30 12" fill="none" stroke="#ffffff" strokeWidth="3" strokeLinecap="round" strokeLinejoin="round" />
    </svg>
  );
}
