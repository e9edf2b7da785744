/**
 * The Driftcase mark: a robot's pose (the arrow) inside its uncertainty ellipse, with the dashed trail
 * of where it drifted from. Drawn for this product; colours are the replay and onboard series colours.
 */
export function LogoMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden focusable="false">
      <rect width="32" height="32" rx="7" fill="#1f2d3f" />
      <ellipse
        cx="19"
        cy="13"
        rx="8"
        ry="5"
        transform="rotate(-25 19 13)"
        fill="#0072B2"
        fillOpacity="0.18"
        stroke="#0072B2"
        strokeWidth="1.8"
      />
      <path
        d="M5 26c4-1 7-4 9-8"
        fill="none"
        stroke="#a9b8cc"
        strokeWidth="2"
        strokeDasharray="2 3"
        strokeLinecap="round"
      />
      <path d="M24.5 7.5L13 13l4.5 1.5 1.5 4.5z" fill="#E69F00" />
    </svg>
  );
}

export function Logo({ tone = 'light' }: { tone?: 'light' | 'dark' }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark />
      <span
        className={`text-lg font-bold tracking-wide ${tone === 'light' ? 'text-white' : 'text-ink'}`}
        style={{ letterSpacing: '0.02em' }}
      >
        Drift<span className={tone === 'light' ? 'text-chrome-300' : 'text-ink-muted'}>case</span>
      </span>
    </span>
  );
}
