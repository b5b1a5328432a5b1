/** Tillwell's mark: a two-leaf seedling rising from a line of soil. Decorative; pair it with the name. */
export function LogoMark({ className = 'size-8' }: { className?: string }) {
  return (
    <svg viewBox="0 0 32 32" className={className} aria-hidden="true" focusable="false">
      <path d="M5 26.5h22" className="stroke-soil" strokeWidth="3" strokeLinecap="round" />
      <path d="M16 26V14.5" className="stroke-leaf" strokeWidth="2.5" strokeLinecap="round" fill="none" />
      <path d="M16 18.5C15 13.6 11.4 10.5 6 10.5c0 5 4 8.3 10 8z" className="fill-leaf" />
      <path d="M16 15c.6-4.6 4-7.6 9.5-7.6 0 4.7-3.7 7.8-9.5 7.6z" className="fill-shoot" />
    </svg>
  );
}

/** The mark and the product name side by side. */
export function Wordmark({ size = 'md' }: { size?: 'md' | 'lg' }) {
  return (
    <span className="inline-flex items-center gap-2">
      <LogoMark className={size === 'lg' ? 'size-11' : 'size-8'} />
      <span className={`font-bold tracking-tight text-soil ${size === 'lg' ? 'text-3xl' : 'text-xl'}`}>Tillwell</span>
    </span>
  );
}
