/** The Fringe Docket mark: two apertures and the fringes between them. */
export function Logo({ className = "h-8 w-8" }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true">
      <rect width="32" height="32" rx="8" fill="#161c2d" />
      <circle cx="8" cy="16" r="3.2" fill="#f27a3a" />
      <circle cx="24" cy="16" r="3.2" fill="#f27a3a" />
      <g stroke="#fdc9a5" strokeLinecap="round">
        <path d="M13 10v12" strokeWidth="1.6" />
        <path d="M16 8v16" strokeWidth="2.2" />
        <path d="M19 10v12" strokeWidth="1.6" />
      </g>
    </svg>
  );
}
