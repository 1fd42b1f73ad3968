export function Wordmark() {
  return (
    <span className="inline-flex items-center gap-2 text-ink">
      {/* A heated plate on a bench: three rising strokes over a bar. */}
      <svg aria-hidden="true" width="26" height="26" viewBox="0 0 26 26" className="shrink-0">
        <rect x="1" y="18" width="24" height="6" rx="1.5" fill="#1f232b" />
        <rect x="4" y="20" width="18" height="2" rx="1" fill="#a5481f" />
        <path d="M7 15c-2-3 2-5 0-9M13 15c-2-3 2-5 0-9M19 15c-2-3 2-5 0-9" stroke="#a5481f" strokeWidth="1.8" fill="none" strokeLinecap="round" />
      </svg>
      <span className="font-serif text-xl font-semibold tracking-tight">
        bench<span className="text-copper">plate</span>
      </span>
    </span>
  );
}
