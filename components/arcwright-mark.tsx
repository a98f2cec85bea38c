/** The Arcwright mark: a light path bending around a dark mass, drawn as a single arc. */
export function ArcwrightMark({ className }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <circle cx="16" cy="18" r="5" fill="#0b0f17" stroke="#7fb7c9" strokeWidth="1.5" />
      <path d="M2 10 C 10 10, 12 26, 16 26 S 22 10, 30 10" fill="none" stroke="#e0894a" strokeWidth="2" />
    </svg>
  );
}
