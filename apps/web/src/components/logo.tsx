/** The mark: a rounded case split by one diagonal gap. One colour, readable at 16 px. */
export function LogoMark({ size = 24, className = 'text-copper-500' }: { size?: number; className?: string }) {
  return (
    <svg width={size} height={size} viewBox="0 0 32 32" aria-hidden="true" className={className}>
      <path d="M5 8.5A3.5 3.5 0 0 1 8.5 5H19.2L10 27H8.5A3.5 3.5 0 0 1 5 23.5Z" fill="currentColor" />
      <path d="M27 23.5a3.5 3.5 0 0 1-3.5 3.5H12.8L22 5h1.5A3.5 3.5 0 0 1 27 8.5Z" fill="currentColor" />
    </svg>
  );
}

export function Logo({ inverted = false }: { inverted?: boolean }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark />
      <span className={`text-lg font-semibold tracking-tight ${inverted ? 'text-paper' : 'text-graphite-950'}`}>Splitcase</span>
    </span>
  );
}
