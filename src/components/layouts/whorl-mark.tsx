/** Whorlbook's mark: a spiral of rounds, like a piece worked from a magic ring. */
export function WhorlMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 64 64" className={className} aria-hidden>
      <circle cx="32" cy="32" r="30" fill="#3F6B4E" />
      <path
        d="M32 32m0-4a4 4 0 1 1-4 4 8 8 0 0 1 8-8 12 12 0 0 1 12 12 16 16 0 0 1-16 16 20 20 0 0 1-20-20"
        fill="none"
        stroke="#F7F1E6"
        strokeWidth="4"
        strokeLinecap="round"
      />
    </svg>
  );
}
