/**
 * The sign-in picture: an invented warehouse map in Driftcase's map palette (slate racks on warm
 * paper, unknown space hatched), the reference path in green, the robot's own belief in orange
 * drifting off it, the replay's particle cloud and ellipse in blue where they part, and the flag.
 * It shows what the product does before a word is read. Drawn for Driftcase; no real site.
 */

// A fixed pseudo-random cloud (a small linear congruential generator), so the picture never changes.
function particleCloud(count: number, cx: number, cy: number): { x: number; y: number }[] {
  let seed = 20261202;
  const next = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648;
  };
  return Array.from({ length: count }, () => {
    const radius = 34 * Math.sqrt(next());
    const angle = next() * 2 * Math.PI;
    return { x: cx + radius * Math.cos(angle) * 1.5, y: cy + radius * Math.sin(angle) * 0.8 };
  });
}

const RACKS = [
  { x: 80, y: 90, w: 40, h: 230 },
  { x: 190, y: 90, w: 40, h: 230 },
  { x: 300, y: 90, w: 40, h: 170 },
  { x: 410, y: 90, w: 40, h: 170 },
  { x: 300, y: 420, w: 150, h: 40 },
];

export function DriftScene({ className }: { className?: string }) {
  const particles = particleCloud(70, 372, 344);
  return (
    <svg
      viewBox="0 0 560 560"
      className={className}
      role="img"
      aria-label="A replayed robot path drifting from the reference on a warehouse map"
    >
      <defs>
        <pattern
          id="unknown-hatch"
          width="8"
          height="8"
          patternUnits="userSpaceOnUse"
          patternTransform="rotate(45)"
        >
          <rect width="8" height="8" fill="#E4E1D8" />
          <line x1="0" y1="0" x2="0" y2="8" stroke="#cfcabd" strokeWidth="2" />
        </pattern>
        <pattern id="cells" width="20" height="20" patternUnits="userSpaceOnUse">
          <path d="M20 0H0V20" fill="none" stroke="#e9e4d8" strokeWidth="1" />
        </pattern>
      </defs>
      <rect width="560" height="560" fill="#F7F4EC" />
      <rect width="560" height="560" fill="url(#cells)" />
      <path d="M480 40h60v480h-60z" fill="url(#unknown-hatch)" />
      <path d="M20 20h520v520H20z" fill="none" stroke="#2E3A4B" strokeWidth="12" />
      {RACKS.map((rack) => (
        <rect key={`${rack.x}-${rack.y}`} {...rack} fill="#2E3A4B" rx="2" />
      ))}
      <path
        d="M60 500C60 420 150 380 155 300S150 130 260 130 250 330 372 344 460 380 470 500"
        fill="none"
        stroke="#009E73"
        strokeWidth="4"
        strokeLinecap="round"
      />
      <path
        d="M60 500C60 420 150 380 155 300S150 130 260 130 260 300 330 360 380 470 430 520"
        fill="none"
        stroke="#E69F00"
        strokeWidth="4"
        strokeDasharray="10 8"
        strokeLinecap="round"
      />
      <rect
        x="300"
        y="300"
        width="150"
        height="90"
        fill="#D55E00"
        fillOpacity="0.12"
        stroke="#D55E00"
        strokeDasharray="4 4"
      />
      {particles.map((p) => (
        <circle
          key={`${p.x.toFixed(2)}-${p.y.toFixed(2)}`}
          cx={p.x}
          cy={p.y}
          r="2.4"
          fill="#0072B2"
          fillOpacity="0.55"
        />
      ))}
      <ellipse
        cx="372"
        cy="344"
        rx="46"
        ry="24"
        transform="rotate(-20 372 344)"
        fill="none"
        stroke="#0072B2"
        strokeWidth="2.5"
      />
      <path d="M372 344l26-12-8 14 8 14z" fill="#0072B2" />
      <g transform="translate(300 282)">
        <path d="M0 0v-26" stroke="#D55E00" strokeWidth="2.5" />
        <path d="M0-26h20l-5 6 5 6H0z" fill="#D55E00" />
      </g>
    </svg>
  );
}
